// Creating a project (with its creator as owner) and changing its name, description or archived state, each with
// its audit entries in the same transaction. Deleting takes the audit log with it, so the caller logs that.
import type { Knex } from "knex";
import type { z } from "zod";
import type { CreateProjectBody, Project, ProjectListItem, UpdateProjectBody } from "@shared/schemas/projects";
import { recordAudit } from "../../db/repositories/audit-log";
import { upsertMembership } from "../../db/repositories/memberships";
import { insertProject, updateProject } from "../../db/repositories/projects";

export async function createProject(
  db: Knex,
  creatorId: string,
  input: z.output<typeof CreateProjectBody>,
  /** A fixed id, for the demo seed whose links must stay stable; the API lets the database choose. */
  id?: string,
): Promise<ProjectListItem> {
  const created = await db.transaction(async (trx) => {
    const p = await insertProject(trx, {
      id,
      name: input.name,
      description: input.description,
      createdBy: creatorId,
    });
    await upsertMembership(trx, p.id, creatorId, "owner");
    await recordAudit(trx, { projectId: p.id, actorId: creatorId, action: "project.create", target: p.name });
    return p;
  });
  return { ...created, role: "owner", memberCount: 1 };
}

/** `before` is the project as it was, so that only real changes are recorded. */
export function changeProject(
  db: Knex,
  actorId: string,
  before: { id: string; name: string; archived: boolean },
  change: z.output<typeof UpdateProjectBody>,
): Promise<Project> {
  return db.transaction(async (trx) => {
    const p = await updateProject(trx, before.id, change);
    const audit = (action: string, target?: string, details?: Record<string, unknown>) =>
      recordAudit(trx, { projectId: before.id, actorId, action, target, details });
    if (change.name !== undefined && change.name !== before.name)
      await audit("project.rename", change.name, { from: before.name });
    if (change.description !== undefined) await audit("project.describe");
    if (change.archived !== undefined && change.archived !== before.archived)
      await audit(change.archived ? "project.archive" : "project.restore", p.name);
    return p;
  });
}
