import { useState } from "react";
import { Link, Navigate } from "react-router-dom";
import { useSession } from "@/features/accounts/api/get-session";
import { SignUpForm } from "@/features/accounts/components/sign-up-form";

export function SignUpRoute() {
  const { data: session } = useSession();
  const [sentTo, setSentTo] = useState<string | null>(null);
  if (session?.user) return <Navigate to="/projects" replace />;
  return (
    <section className="mx-auto max-w-sm space-y-6 rounded-lg border border-slate-200 bg-white p-6 shadow-sm">
      <h1 className="text-2xl font-semibold">Create an account</h1>
      {sentTo ? (
        <div role="status" className="space-y-2 text-sm text-slate-700">
          <p className="font-medium">Check your e-mail.</p>
          <p>
            We sent a message to <strong>{sentTo}</strong>. Open the link in it to finish creating your account; it
            works once, for 24 hours. If the address already has an account, the message says so instead.
          </p>
        </div>
      ) : (
        <SignUpForm onRequested={setSentTo} />
      )}
      <p className="text-sm text-slate-600">
        Already have an account?{" "}
        <Link to="/sign-in" className="font-medium text-brand-700 hover:underline">
          Sign in
        </Link>
      </p>
    </section>
  );
}
