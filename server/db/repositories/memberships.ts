// Project memberships: who holds which role in which project.
import type { Knex } from "knex";
import type { ProjectRole, SiteRole } from "@shared/types/roles";

export interface Member {
  userId: string;
  email: string;
  displayName: string;
  siteRole: SiteRole;
  role: ProjectRole;
  joinedAt: string;
}

interface MemberRow {
  user_id: string;
  email: string;
  display_name: string;
  site_role: SiteRole;
  role: ProjectRole;
  created_at: Date;
}

function toMember(r: MemberRow): Member {
  return {
    userId: r.user_id,
    email: r.email,
    displayName: r.display_name,
    siteRole: r.site_role,
    role: r.role,
    joinedAt: r.created_at.toISOString(),
  };
}

export async function roleOf(db: Knex, projectId: string, userId: string): Promise<ProjectRole | null> {
  const row = await db("memberships").select("role").where({ project_id: projectId, user_id: userId }).first();
  return (row?.role as ProjectRole | undefined) ?? null;
}

export async function listMembers(db: Knex, projectId: string): Promise<Member[]> {
  const rows = await db("memberships as m")
    .join("users as u", "u.id", "m.user_id")
    .select("m.user_id", "u.email", "u.display_name", "u.site_role", "m.role", "m.created_at")
    .where("m.project_id", projectId)
    .orderByRaw(
      "case m.role when 'owner' then 0 when 'modeler' then 1 when 'reviewer' then 2 else 3 end, lower(u.display_name)",
    );
  return (rows as MemberRow[]).map(toMember);
}

export async function findMember(db: Knex, projectId: string, userId: string): Promise<Member | null> {
  const row = await db("memberships as m")
    .join("users as u", "u.id", "m.user_id")
    .select("m.user_id", "u.email", "u.display_name", "u.site_role", "m.role", "m.created_at")
    .where({ "m.project_id": projectId, "m.user_id": userId })
    .first();
  return row ? toMember(row as MemberRow) : null;
}

/** Adds the person, or changes the role of someone already in the project. */
export async function upsertMembership(db: Knex, projectId: string, userId: string, role: ProjectRole): Promise<void> {
  await db("memberships")
    .insert({ project_id: projectId, user_id: userId, role })
    .onConflict(["project_id", "user_id"])
    .merge({ role, updated_at: db.fn.now() });
}

export async function setRole(db: Knex, projectId: string, userId: string, role: ProjectRole): Promise<void> {
  await db("memberships").where({ project_id: projectId, user_id: userId }).update({ role, updated_at: db.fn.now() });
}

export async function deleteMembership(db: Knex, projectId: string, userId: string): Promise<void> {
  await db("memberships").where({ project_id: projectId, user_id: userId }).delete();
}

/**
 * Owners of the project, with their rows locked: the last-owner check and the change it guards run in one
 * transaction, so two owners demoting each other at once cannot leave the project without one.
 */
export async function lockOwners(trx: Knex.Transaction, projectId: string): Promise<string[]> {
  const rows = await trx("memberships").select("user_id").where({ project_id: projectId, role: "owner" }).forUpdate();
  return rows.map((r: { user_id: string }) => r.user_id);
}
