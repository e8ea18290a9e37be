// The page a sign-up link opens. The token travels in the URL's fragment, which browsers never send to a server
// or put in a Referer, and is posted once.
import { useEffect, useRef } from "react";
import { Link, useNavigate } from "react-router-dom";
import { Alert } from "@/components/ui/alert";
import { useConfirmSignUp } from "@/features/accounts/api/sign-up";

export function SignUpFinishRoute() {
  const navigate = useNavigate();
  const confirm = useConfirmSignUp();
  const posted = useRef(false);
  useEffect(() => {
    if (posted.current) return;
    posted.current = true;
    const token = window.location.hash.slice(1);
    confirm.mutate(token, { onSuccess: () => navigate("/projects", { replace: true }) });
  }, [confirm, navigate]);
  return (
    <section className="mx-auto max-w-sm space-y-4 rounded-lg border border-slate-200 bg-white p-6 shadow-sm">
      <h1 className="text-2xl font-semibold">Finishing your account</h1>
      {confirm.isError ? (
        <>
          <Alert>{confirm.error.message}</Alert>
          <p className="text-sm">
            <Link to="/sign-up" className="font-medium text-brand-700 hover:underline">
              Sign up again
            </Link>{" "}
            or{" "}
            <Link to="/sign-in" className="font-medium text-brand-700 hover:underline">
              sign in
            </Link>
            .
          </p>
        </>
      ) : (
        <p role="status" className="text-sm text-slate-700">
          Creating your account…
        </p>
      )}
    </section>
  );
}
