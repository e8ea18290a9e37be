// Sign-in screen; returns the person to the page that sent them here (?next=), never to another site.
import { Link, Navigate, useNavigate, useSearchParams } from "react-router-dom";
import { useSession } from "@/features/accounts/api/get-session";
import { SignInForm } from "@/features/accounts/components/sign-in-form";

export function safeNext(next: string | null): string {
  return next && next.startsWith("/") && !next.startsWith("//") ? next : "/projects";
}

export function SignInRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const next = safeNext(params.get("next"));
  const { data: session } = useSession();
  if (session?.user) return <Navigate to={next} replace />;
  return (
    <section className="mx-auto max-w-sm space-y-6 rounded-lg border border-slate-200 bg-white p-6 shadow-sm">
      <h1 className="text-2xl font-semibold">Sign in</h1>
      <SignInForm defaultEmail={params.get("email") ?? ""} onSignedIn={() => navigate(next, { replace: true })} />
      <p className="text-sm text-slate-600">
        New here?{" "}
        <Link to="/sign-up" className="font-medium text-brand-700 hover:underline">
          Create an account
        </Link>
      </p>
    </section>
  );
}
