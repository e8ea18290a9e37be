// Guards the screens that need an account: visitors are sent to sign-in, which brings them back afterwards.
import type { ReactNode } from "react";
import { Navigate, Outlet, useLocation } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { useSession } from "../api/get-session";

export function RequireSignIn({ children }: { children?: ReactNode }) {
  const { data: session, error, isPending } = useSession();
  const location = useLocation();
  if (isPending) return <p className="text-sm text-slate-500">Loading…</p>;
  if (error) return <Alert>{error.message}</Alert>;
  if (!session.user) {
    const next = location.pathname + location.search;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  return children ?? <Outlet />;
}
