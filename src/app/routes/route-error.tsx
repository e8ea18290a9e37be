// Shown when a route throws while loading or rendering: a readable message instead of a blank page.
import { isRouteErrorResponse, Link, useRouteError } from "react-router-dom";
import { ApiError } from "@/lib/api-client";

function describe(error: unknown): { title: string; message: string } {
  if (isRouteErrorResponse(error))
    return { title: `${error.status} ${error.statusText}`, message: String(error.data ?? "") };
  if (error instanceof ApiError)
    return { title: error.status === 404 ? "Not found" : "The server refused this request", message: error.message };
  if (error instanceof Error) return { title: "Something went wrong", message: error.message };
  return { title: "Something went wrong", message: "An unknown error occurred." };
}

export function RouteErrorBoundary() {
  const { title, message } = describe(useRouteError());
  return (
    <div role="alert" className="mx-auto max-w-lg p-8 text-center" data-testid="route-error">
      <h1 className="text-xl font-semibold text-red-700">{title}</h1>
      <p className="mt-2 text-slate-700">{message}</p>
      <Link to="/" className="mt-6 inline-block text-brand-700 underline">
        Go to the overview
      </Link>
    </div>
  );
}
