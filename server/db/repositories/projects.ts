// Projects and the list each person may see (their memberships; site admins see all).
import type { Knex } from "knex";
import type { ProjectRole } from "@shared/types/roles";

export interface Project {
  id: string;
  name: string;
  description: string;
  archived: boolean;
  archivedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface ProjectListItem extends Project {
  role: ProjectRole | null;
  memberCount: number;
}

interface ProjectRow {
  id: string;
  name: string;
  description: string;
  archived_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

// "Last change" is the newest of the project's own edits, its audit log (models, revisions, runs started or
// cancelled, reductions, members) and its runs' ends, which no person records; both lookups use a
// (project_id, ...) index, so the cost stays flat as the project grows.
const lastChange = `greatest(p.updated_at,
  (select max(a.created_at) from audit_log a where a.project_id = p.id),
  (select max(r.finished_at) from runs r where r.project_id = p.id)) as updated_at`;

function projectColumns(db: Knex) {
  return ["p.id", "p.name", "p.description", "p.archived_at", "p.created_at", db.raw(lastChange)];
}

function toProject(r: ProjectRow): Project {
  return {
    id: r.id,
    name: r.name,
    description: r.description,
    archived: r.archived_at !== null,
    archivedAt: r.archived_at?.toISOString() ?? null,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
  };
}

export async function findProject(db: Knex, id: string): Promise<Project | null> {
  const row = await db("projects as p").select(projectColumns(db)).where("p.id", id).first();
  return row ? toProject(row as ProjectRow) : null;
}

/** Every project the person belongs to, or every project for a site admin, with the caller's role and head count. */
export async function listProjectsFor(db: Knex, user: { id: string; siteRole: string }): Promise<ProjectListItem[]> {
  const q = db("projects as p")
    .leftJoin("memberships as mine", function () {
      this.on("mine.project_id", "p.id").andOnVal("mine.user_id", user.id);
    })
    .select([
      ...projectColumns(db),
      "mine.role as role",
      db.raw("(select count(*)::int from memberships c where c.project_id = p.id) as member_count"),
    ])
    .orderBy("p.name");
  if (user.siteRole !== "admin") q.whereNotNull("mine.role");
  const rows = (await q) as (ProjectRow & { role: ProjectRole | null; member_count: number })[];
  return rows.map((r) => ({ ...toProject(r), role: r.role, memberCount: r.member_count }));
}

export async function insertProject(
  db: Knex,
  input: { name: string; description: string; createdBy: string; id?: string },
): Promise<Project> {
  const [row] = await db("projects as p")
    .insert({ id: input.id, name: input.name, description: input.description, created_by: input.createdBy })
    .returning(["id", "name", "description", "archived_at", "created_at", "updated_at"]);
  return toProject(row as ProjectRow);
}

export async function updateProject(
  db: Knex,
  id: string,
  patch: { name?: string; description?: string; archived?: boolean },
): Promise<Project> {
  const changes: Record<string, unknown> = { updated_at: db.fn.now() };
  if (patch.name !== undefined) changes.name = patch.name;
  if (patch.description !== undefined) changes.description = patch.description;
  if (patch.archived !== undefined) changes.archived_at = patch.archived ? db.fn.now() : null;
  const [row] = await db("projects")
    .where({ id })
    .update(changes)
    .returning(["id", "name", "description", "archived_at", "created_at", "updated_at"]);
  return toProject(row as ProjectRow);
}

export async function deleteProject(db: Knex, id: string): Promise<void> {
  await db("projects").where({ id }).delete();
}
