// The project's members. Those who manage the project change roles and remove people; the server keeps the last
// owner in place and its message (LAST_OWNER) is shown as it comes.
import { useState } from "react";
import { PROJECT_ROLES, type ProjectRole } from "@shared/types/roles";
import { Alert } from "@/components/ui/alert";
import { Dialog } from "@/components/ui/dialog";
import { Button } from "@/components/ui/button";
import { useChangeMemberRole } from "../api/change-member-role";
import { useMembers } from "../api/list-members";
import { useRemoveMember } from "../api/remove-member";

const roleHelp: Record<ProjectRole, string> = {
  owner: "everything, including members and deletion",
  modeler: "create, import, edit and analyse models",
  reviewer: "read, comment, approve or reject results",
  viewer: "read only",
};

export function MembersPanel({
  projectId,
  canManage,
  currentUserId,
}: {
  projectId: string;
  canManage: boolean;
  currentUserId: string;
}) {
  const { data: members, error, isPending } = useMembers(projectId);
  const changeRole = useChangeMemberRole(projectId);
  const remove = useRemoveMember(projectId);
  const [actionError, setActionError] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [confirming, setConfirming] = useState<{ userId: string; displayName: string; role: ProjectRole } | null>(null);

  if (isPending) return <p className="text-sm text-slate-500">Loading members…</p>;
  if (error) return <Alert>{error.message}</Alert>;

  const run = async (action: () => Promise<unknown>, done?: string) => {
    setActionError(null);
    setNotice(null);
    try {
      await action();
      if (done) setNotice(done);
    } catch (err) {
      setActionError((err as Error).message);
    }
  };

  return (
    <div className="space-y-3">
      {actionError && <Alert>{actionError}</Alert>}
      {notice && (
        <p
          role="status"
          className="rounded-md bg-emerald-50 px-3 py-2 text-sm text-emerald-800"
          data-testid="member-notice"
        >
          {notice}
        </p>
      )}
      <Dialog
        open={confirming !== null}
        title={`Remove ${confirming?.displayName ?? ""} from the project?`}
        onClose={() => setConfirming(null)}
      >
        <p className="text-sm text-slate-700">
          {confirming?.displayName} ({confirming?.role}) loses access to this project at once. Their models, runs and
          comments stay. To undo, invite them again.
        </p>
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={() => setConfirming(null)}>
            Keep them
          </Button>
          <Button
            variant="danger"
            data-testid="confirm-remove"
            onClick={() => {
              const who = confirming;
              setConfirming(null);
              if (who)
                void run(() => remove.mutateAsync(who.userId), `${who.displayName} was removed from the project.`);
            }}
          >
            Remove
          </Button>
        </div>
      </Dialog>
      <div className="overflow-x-auto rounded-lg border border-slate-200 bg-white">
        <table className="min-w-full divide-y divide-slate-200 text-sm" data-testid="members-table">
          <thead className="bg-slate-50 text-left text-xs font-semibold uppercase tracking-wide text-slate-600">
            <tr>
              <th className="px-4 py-2">Name</th>
              <th className="px-4 py-2">E-mail</th>
              <th className="px-4 py-2">Role</th>
              {canManage && (
                <th className="px-4 py-2">
                  <span className="sr-only">Actions</span>
                </th>
              )}
            </tr>
          </thead>
          <tbody className="divide-y divide-slate-100">
            {members.map((m) => (
              <tr key={m.userId} data-testid="member-row">
                <td className="px-4 py-2 font-medium text-slate-900">
                  {m.displayName}
                  {m.userId === currentUserId && (
                    <span className="ml-2 rounded bg-slate-100 px-1.5 py-0.5 text-xs text-slate-600">you</span>
                  )}
                </td>
                <td className="px-4 py-2 text-slate-600">{m.email}</td>
                <td className="px-4 py-2">
                  {canManage ? (
                    <select
                      aria-label={`Role of ${m.displayName}`}
                      value={m.role}
                      onChange={(e) =>
                        run(
                          () => changeRole.mutateAsync({ userId: m.userId, role: e.target.value as ProjectRole }),
                          `${m.displayName} is now ${e.target.value} (was ${m.role}): ${roleHelp[e.target.value as ProjectRole]}`,
                        )
                      }
                      className="rounded-md border border-slate-300 bg-white px-2 py-1 text-sm"
                    >
                      {PROJECT_ROLES.map((r) => (
                        <option key={r} value={r}>
                          {r}
                        </option>
                      ))}
                    </select>
                  ) : (
                    <span title={roleHelp[m.role]} className="capitalize">
                      {m.role}
                    </span>
                  )}
                </td>
                {canManage && (
                  <td className="px-4 py-2 text-right">
                    <Button
                      variant="ghost"
                      size="sm"
                      onClick={() => setConfirming({ userId: m.userId, displayName: m.displayName, role: m.role })}
                      aria-label={`Remove ${m.displayName}`}
                    >
                      Remove
                    </Button>
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <dl className="grid gap-x-6 gap-y-1 text-xs text-slate-500 sm:grid-cols-2">
        {PROJECT_ROLES.map((r) => (
          <div key={r}>
            <dt className="inline font-semibold capitalize text-slate-600">{r}: </dt>
            <dd className="inline">{roleHelp[r]}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}
