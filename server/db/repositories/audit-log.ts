// The per-project audit log: who did what, when. Every state-changing route records one entry in the same
// transaction as its change, so the log never claims something that was rolled back.
import type { Knex } from "knex";

export interface AuditEntry {
  id: string;
  projectId: string;
  actorId: string | null;
  actorName: string;
  action: string;
  target: string | null;
  details: Record<string, unknown>;
  createdAt: string;
}

export interface AuditInput {
  projectId: string;
  actorId: string | null;
  /** A dotted verb such as "project.rename", "member.role", "model.create". */
  action: string;
  target?: string;
  details?: Record<string, unknown>;
}

export async function recordAudit(db: Knex, input: AuditInput): Promise<void> {
  await db("audit_log").insert({
    project_id: input.projectId,
    actor_id: input.actorId,
    // The name is copied at write time so the entry still reads after the account is renamed or removed.
    actor_name: db.raw("coalesce((select display_name from users where id = ?), '')", [input.actorId]),
    action: input.action,
    target: input.target ?? null,
    details: JSON.stringify(input.details ?? {}),
  });
}

interface AuditRow {
  id: string;
  project_id: string;
  actor_id: string | null;
  actor_name: string;
  action: string;
  target: string | null;
  details: Record<string, unknown>;
  created_at: Date;
}

/** Newest first; `before` is the id of the last entry already shown, for paging back in time. */
export async function listAudit(
  db: Knex,
  projectId: string,
  opts: { limit: number; before?: string },
): Promise<AuditEntry[]> {
  const q = db<AuditRow>("audit_log").where({ project_id: projectId }).orderBy("id", "desc").limit(opts.limit);
  if (opts.before) q.andWhere("id", "<", opts.before);
  const rows = await q;
  return rows.map((r) => ({
    id: String(r.id),
    projectId: r.project_id,
    actorId: r.actor_id,
    actorName: r.actor_name,
    action: r.action,
    target: r.target,
    details: r.details,
    createdAt: r.created_at.toISOString(),
  }));
}
