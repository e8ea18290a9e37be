// The project's history, newest first, in plain sentences.
import { Link } from "react-router-dom";
import type { AuditEntry } from "@shared/schemas/projects";
import { Alert } from "@/components/ui/alert";
import { plural } from "@/lib/plural";
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
  "model.create": () => "created the model",
  "model.import": () => "imported the model",
  "model.generate": () => "generated the model",
  "model.revise": () => "saved a new revision of the model",
  "reduction.search": () => "started a reduction search",
  "reduction.found": (e) => `'s search stored ${plural(Number(e.details.count ?? 0), "reduction")} for review`,
  "reduction.propose": () => "proposed a search finding for review",
  "reduction.upload": () => "submitted a certificate",
  "reduction.approve": () => "approved a reduction",
  "reduction.reject": (e) => `rejected a reduction${e.details.comment ? `: "${String(e.details.comment)}"` : ""}`,
  "reduction.verify": (e) => `re-verified a reduction's certificate (${e.details.isValid ? "valid" : "not valid"})`,
  "reduction.comment": () => "commented on a reduction",
  "reduction.save-target": () => "saved a discovered target as a model",
  "run.start": () => "started a run",
  "token.create": (e) =>
    `created the ${String(e.details.scope)} access token "${e.target ?? ""}", which can act in this project`,
  "token.revoke": (e) => `revoked the access token "${e.target ?? ""}"`,
};

const isId = (s: string | null) =>
  s !== null && /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(s);

/** Where an entry's target lives, when it is something with a page (a model, a run, a reduction). */
function linkOf(projectId: string, e: AuditEntry): string | null {
  if (!isId(e.target)) return null;
  if (e.action.startsWith("model.")) return `/projects/${projectId}/models/${e.target}`;
  if (e.action === "reduction.found" || e.action === "reduction.search" || e.action.startsWith("run."))
    return `/projects/${projectId}/runs/${e.target}`;
  if (e.action.startsWith("reduction.")) return `/projects/${projectId}/reductions/${e.target}`;
  return null;
}

/** Ids are never shown: an entry names its target (a model's name when known) or links to it. */
function describe(e: AuditEntry, names: Record<string, string>): string {
  const name = e.target ? names[e.target] : undefined;
  const sentence = verbs[e.action]?.(e);
  if (sentence) return name ? `${sentence} "${name}"` : sentence;
  const target = isId(e.target) ? name : (e.target ?? undefined);
  return `${e.action.replace(".", " ")}${target ? ` "${target}"` : ""}`;
}

export function AuditList({ projectId, names = {} }: { projectId: string; names?: Record<string, string> }) {
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
            <span className="font-medium text-slate-900">{e.actorName || "Someone"}</span>
            {e.action === "reduction.found" ? "" : " "}
            {describe(e, names)}
            {linkOf(projectId, e) && (
              <>
                {" "}
                <Link to={linkOf(projectId, e)!} className="text-brand-700 hover:underline">
                  open
                </Link>
              </>
            )}
          </span>
        </li>
      ))}
    </ol>
  );
}
