import type { Knex } from "knex";
import { hashPassword } from "../server/http/password-hash";

// The invented Tidewater Lab, which studies the (equally invented) Glimmerfin alga: a site admin and one member
// for each project role, all with the password "demo-password", and the lab's demo project. Upserts only.
export const DEMO_PROJECT_ID = "00000000-0000-4000-8000-000000000001";
export const DEMO_PASSWORD = "demo-password";

const people = [
  { email: "admin@demo.emulant.test", displayName: "Ada Quillon", siteRole: "admin", projectRole: null },
  { email: "owner@demo.emulant.test", displayName: "Oriel Fenwick", siteRole: "member", projectRole: "owner" },
  { email: "modeler@demo.emulant.test", displayName: "Mira Castellan", siteRole: "member", projectRole: "modeler" },
  { email: "reviewer@demo.emulant.test", displayName: "Rowan Ashdown", siteRole: "member", projectRole: "reviewer" },
  { email: "viewer@demo.emulant.test", displayName: "Vesna Pellow", siteRole: "member", projectRole: "viewer" },
] as const;

export async function seed(knex: Knex): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const ids = new Map<string, string>();
  for (const p of people) {
    const [row] = await knex("users")
      .insert({ email: p.email, display_name: p.displayName, site_role: p.siteRole, password_hash: passwordHash })
      .onConflict("email")
      .merge(["display_name", "site_role", "password_hash"])
      .returning("id");
    ids.set(p.email, (row as { id: string }).id);
  }
  await knex("projects")
    .insert({
      id: DEMO_PROJECT_ID,
      name: "Glimmerfin regulatory atlas",
      description: "Tidewater Lab's Boolean models of the Glimmerfin alga's light-response and division circuits.",
      created_by: ids.get("owner@demo.emulant.test"),
      archived_at: null,
    })
    .onConflict("id")
    .merge(["name", "description", "archived_at"]);
  for (const p of people) {
    if (!p.projectRole) continue;
    await knex("memberships")
      .insert({ project_id: DEMO_PROJECT_ID, user_id: ids.get(p.email), role: p.projectRole })
      .onConflict(["project_id", "user_id"])
      .merge(["role"]);
  }
  const hasHistory = await knex("audit_log").where({ project_id: DEMO_PROJECT_ID, action: "project.create" }).first();
  if (!hasHistory) {
    await knex("audit_log").insert({
      project_id: DEMO_PROJECT_ID,
      actor_id: ids.get("owner@demo.emulant.test"),
      actor_name: "Oriel Fenwick",
      action: "project.create",
      target: "Glimmerfin regulatory atlas",
      details: JSON.stringify({}),
    });
  }
}
