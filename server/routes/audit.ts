// A project's audit log, newest first. Invitations name addresses of people who are not members (yet), which only
// those who manage membership may read; everyone else sees the address masked.
import type { Knex } from "knex";
import { z } from "zod";
import { AuditEntry, AuditQuery, ProjectParams } from "@shared/schemas/projects";
import { can } from "@shared/types/roles";
import { listAudit } from "../db/repositories/audit-log";
import { project, routeGroup, type RouteGroup } from "../http/route-group";

/** "lena@example.org" → "l…@example.org": enough to tell entries apart, not enough to write to someone. */
export function maskAddress(address: string): string {
  const at = address.lastIndexOf("@");
  return at > 0 ? `${[...address][0]}…${address.slice(at)}` : "…";
}

function withoutInviteeAddresses(entry: AuditEntry): AuditEntry {
  return entry.action.startsWith("invitation.") && entry.target !== null
    ? { ...entry, target: maskAddress(entry.target) }
    : entry;
}

export function auditRoutes(deps: { db: Knex }): RouteGroup {
  const routes = routeGroup({ mountPath: "/projects/:projectId/audit", tag: "projects", db: deps.db });
  routes.get("/", {
    summary: "The project's audit log, newest first; page back with `before` (invitee addresses masked for non-owners)",
    access: project("project:read"),
    params: ProjectParams,
    query: AuditQuery,
    response: z.array(AuditEntry),
    async handler({ project, user, query }) {
      const entries = await listAudit(deps.db, project.id, query);
      return can(project.role, user.siteRole, "project:manage") ? entries : entries.map(withoutInviteeAddresses);
    },
  });
  return routes;
}
