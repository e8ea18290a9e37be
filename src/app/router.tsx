// One data router for the whole app; each route module composes features for one screen.
import { createBrowserRouter, RouterProvider } from "react-router-dom";
import { AppShell } from "@/components/layout/app-shell";
import { AutomataRoute } from "./routes/automata";
import { AutomataRuleRoute } from "./routes/automata-rule";
import { HomeRoute } from "./routes/home";
import { NotFoundRoute } from "./routes/not-found";
import { RouteErrorBoundary } from "./routes/route-error";

export const routes = [
  {
    element: <AppShell />,
    errorElement: <RouteErrorBoundary />,
    children: [
      { index: true, element: <HomeRoute /> },
      { path: "automata", element: <AutomataRoute /> },
      { path: "automata/rules/:rule", element: <AutomataRuleRoute /> },
      { path: "*", element: <NotFoundRoute /> },
    ],
  },
];

const router = createBrowserRouter(routes);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
