import { useNavigate, useParams } from "react-router-dom";
import { useSession } from "@/features/accounts/api/get-session";
import { AcceptInvitationPanel } from "@/features/projects/components/accept-invitation-panel";

export function AcceptInvitationRoute() {
  const { token = "" } = useParams();
  const navigate = useNavigate();
  const { data: session, isPending } = useSession();
  return (
    <section className="mx-auto max-w-lg space-y-6 rounded-lg border border-slate-200 bg-white p-6 shadow-sm">
      <h1 className="text-2xl font-semibold">Project invitation</h1>
      {isPending ? (
        <p className="text-sm text-slate-500">Loading…</p>
      ) : (
        <AcceptInvitationPanel
          token={token}
          signedInEmail={session?.user?.email ?? null}
          onAccepted={(projectId) => navigate(`/projects/${projectId}`, { replace: true })}
        />
      )}
    </section>
  );
}
