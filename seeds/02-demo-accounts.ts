import type { Knex } from "knex";
import { upsertMembership } from "../server/db/repositories/memberships";
import { findProject, updateProject } from "../server/db/repositories/projects";
import { upsertUser } from "../server/db/repositories/users";
import { hashPassword } from "../server/http/password-hash";
import { createProject } from "../server/services/projects/project-settings";

// The invented Tidewater Lab, which studies the (equally invented) Glimmerfin alga: a site admin and one member
// for each project role, all with the password "demo-password", and the lab's demo project. The project is made
// by the same service as the API's (creator as owner, audit entry); a second run only brings everything back to
// the demo's state.
export const DEMO_PROJECT_ID = "00000000-0000-4000-8000-000000000001";
export const DEMO_PASSWORD = "demo-password";

const people = [
  { email: "admin@demo.emulant.test", displayName: "Ada Quillon", siteRole: "admin", projectRole: null },
  { email: "owner@demo.emulant.test", displayName: "Oriel Fenwick", siteRole: "member", projectRole: "owner" },
  { email: "modeler@demo.emulant.test", displayName: "Mira Castellan", siteRole: "member", projectRole: "modeler" },
  { email: "reviewer@demo.emulant.test", displayName: "Rowan Ashdown", siteRole: "member", projectRole: "reviewer" },
  { email: "viewer@demo.emulant.test", displayName: "Vesna Pellow", siteRole: "member", projectRole: "viewer" },
] as const;

const project = {
  name: "Glimmerfin regulatory atlas",
  description: "Tidewater Lab's Boolean models of the Glimmerfin alga's light-response and division circuits.",
};

export async function seed(knex: Knex): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const ids = new Map<string, string>();
  for (const p of people) ids.set(p.email, (await upsertUser(knex, { ...p, passwordHash })).id);
  const owner = ids.get("owner@demo.emulant.test")!;
  if (await findProject(knex, DEMO_PROJECT_ID))
    await updateProject(knex, DEMO_PROJECT_ID, { ...project, archived: false });
  else await createProject(knex, owner, project, DEMO_PROJECT_ID);
  for (const p of people)
    if (p.projectRole) await upsertMembership(knex, DEMO_PROJECT_ID, ids.get(p.email)!, p.projectRole);
}
