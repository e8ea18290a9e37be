import { Link, Navigate, useNavigate } from "react-router-dom";
import { useSession } from "@/features/accounts/api/get-session";
import { SignUpForm } from "@/features/accounts/components/sign-up-form";

export function SignUpRoute() {
  const navigate = useNavigate();
  const { data: session } = useSession();
  if (session?.user) return <Navigate to="/projects" replace />;
  return (
    <section className="mx-auto max-w-sm space-y-6 rounded-lg border border-slate-200 bg-white p-6 shadow-sm">
      <h1 className="text-2xl font-semibold">Create an account</h1>
      <SignUpForm onSignedUp={() => navigate("/projects", { replace: true })} />
      <p className="text-sm text-slate-600">
        Already have an account?{" "}
        <Link to="/sign-in" className="font-medium text-brand-700 hover:underline">
          Sign in
        </Link>
      </p>
    </section>
  );
}
