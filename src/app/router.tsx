// One data router for the whole app; each route module composes features for one screen.
import { createBrowserRouter, RouterProvider } from "react-router-dom";
import { AppShell } from "@/components/layout/app-shell";
import { RequireSignIn } from "@/features/accounts/components/require-sign-in";
import { UserMenu } from "@/features/accounts/components/user-menu";
import { useSession } from "@/features/accounts/api/get-session";
import { NotificationBell } from "@/features/runs";
import { HealthBadge } from "@/features/system/components/health-badge";
import { AcceptInvitationRoute } from "./routes/accept-invitation";
import { AutomataRoute } from "./routes/automata";
import { AutomataRuleRoute } from "./routes/automata-rule";
import { HomeRoute } from "./routes/home";
import { MailboxRoute } from "./routes/mailbox";
import { ModelDetailRoute } from "./routes/model-detail";
import { ModelPerturbedRoute } from "./routes/model-perturbed";
import { ModelNewRoute } from "./routes/model-new";
import { NotFoundRoute } from "./routes/not-found";
import { ProfileRoute } from "./routes/profile";
import { ApiReferenceRoute } from "./routes/api-reference";
import { ProjectAuditRoute } from "./routes/project-audit";
import { ProjectLayoutRoute } from "./routes/project-layout";
import { ProjectListRoute } from "./routes/project-list";
import { ProjectMembersRoute } from "./routes/project-members";
import { ProjectHierarchyRoute } from "./routes/project-hierarchy";
import { ProjectModelsRoute } from "./routes/project-models";
import { ProjectOverviewRoute } from "./routes/project-overview";
import { ProjectReductionsRoute } from "./routes/project-reductions";
import { ProjectRunsRoute } from "./routes/project-runs";
import { ReductionDetailRoute } from "./routes/reduction-detail";
import { RunDetailRoute } from "./routes/run-detail";
import { RouteErrorBoundary } from "./routes/route-error";
import { SignInRoute } from "./routes/sign-in";
import { SignUpRoute } from "./routes/sign-up";
import { SignUpFinishRoute } from "./routes/sign-up-finish";

/** Nobody signed in: nothing to ask /api/notifications for. */
function SignedInBell() {
  const session = useSession();
  return <NotificationBell signedIn={Boolean(session.data?.user)} />;
}

export const routes = [
  {
    element: <AppShell accountSlot={<UserMenu />} notificationSlot={<SignedInBell />} statusSlot={<HealthBadge />} />,
    errorElement: <RouteErrorBoundary />,
    children: [
      { index: true, element: <HomeRoute /> },
      { path: "sign-in", element: <SignInRoute /> },
      { path: "sign-up", element: <SignUpRoute /> },
      { path: "sign-up/finish", element: <SignUpFinishRoute /> },
      { path: "invitations/:token", element: <AcceptInvitationRoute /> },
      { path: "api-reference", element: <ApiReferenceRoute /> },
      {
        element: <RequireSignIn />,
        children: [
          { path: "automata", element: <AutomataRoute /> },
          { path: "automata/rules/:rule", element: <AutomataRuleRoute /> },
          { path: "profile", element: <ProfileRoute /> },
          { path: "mailbox", element: <MailboxRoute /> },
          { path: "projects", element: <ProjectListRoute /> },
          {
            path: "projects/:projectId",
            element: <ProjectLayoutRoute />,
            children: [
              { index: true, element: <ProjectOverviewRoute /> },
              { path: "models", element: <ProjectModelsRoute /> },
              { path: "models/new", element: <ModelNewRoute /> },
              { path: "models/:modelId", element: <ModelDetailRoute /> },
              { path: "models/:modelId/perturbed", element: <ModelPerturbedRoute /> },
              { path: "runs", element: <ProjectRunsRoute /> },
              { path: "runs/:runId", element: <RunDetailRoute /> },
              { path: "reductions", element: <ProjectReductionsRoute /> },
              { path: "reductions/:reductionId", element: <ReductionDetailRoute /> },
              { path: "hierarchy", element: <ProjectHierarchyRoute /> },
              { path: "members", element: <ProjectMembersRoute /> },
              { path: "audit", element: <ProjectAuditRoute /> },
            ],
          },
        ],
      },
      { path: "*", element: <NotFoundRoute /> },
    ],
  },
];

const router = createBrowserRouter(routes);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
