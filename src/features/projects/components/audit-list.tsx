// The project's history, newest first, in plain sentences.
import type { AuditEntry } from "@shared/schemas/projects";
import { Alert } from "@/components/ui/alert";
import { useAudit } from "../api/list-audit";

const verbs: Record<string, (e: AuditEntry) => string> = {
  "project.create": (e) => `created the project "${e.target ?? ""}"`,
  "project.rename": (e) => `renamed the project from "${String(e.details.from ?? "")}" to "${e.target ?? ""}"`,
  "project.describe": () => "changed the project description",
  "project.archive": () => "archived the project",
  "project.restore": () => "restored the project",
  "member.role": (e) =>
    `changed ${e.target ?? "someone"}'s role from ${String(e.details.from)} to ${String(e.details.to)}`,
  "member.remove": (e) => `removed ${e.target ?? "someone"} (${String(e.details.role)})`,
  "invitation.create": (e) => `invited ${e.target ?? "someone"} as ${String(e.details.role)}`,
  "invitation.revoke": (e) => `withdrew the invitation to ${e.target ?? "someone"}`,
  "invitation.accept": (e) => `joined as ${String(e.details.role)}`,
};

/** Actions from other features read as "did model.create on X" until they add a sentence here. */
function describe(e: AuditEntry): string {
  return verbs[e.action]?.(e) ?? `${e.action.replace(".", " ")}${e.target ? ` "${e.target}"` : ""}`;
}

export function AuditList({ projectId }: { projectId: string }) {
  const { data: entries, error, isPending } = useAudit(projectId);
  if (isPending) return <p className="text-sm text-slate-500">Loading the history…</p>;
  if (error) return <Alert>{error.message}</Alert>;
  if (entries.length === 0) return <p className="text-sm text-slate-500">Nothing has happened here yet.</p>;
  return (
    <ol
      className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white text-sm"
      data-testid="audit-log"
    >
      {entries.map((e) => (
        <li key={e.id} className="flex flex-wrap items-baseline gap-x-3 px-4 py-2">
          <time className="w-40 shrink-0 text-xs tabular-nums text-slate-500" dateTime={e.createdAt}>
            {new Date(e.createdAt).toLocaleString()}
          </time>
          <span>
            <span className="font-medium text-slate-900">{e.actorName || "Someone"}</span> {describe(e)}
          </span>
        </li>
      ))}
    </ol>
  );
}
