// A project's audit log, newest first.
import type { Knex } from "knex";
import { z } from "zod";
import { AuditEntry, AuditQuery, ProjectParams } from "@shared/schemas/projects";
import { listAudit } from "../db/repositories/audit-log";
import { project, routeGroup, type RouteGroup } from "../http/route-group";

export function auditRoutes(deps: { db: Knex }): RouteGroup {
  const routes = routeGroup({ mountPath: "/projects/:projectId/audit", tag: "projects", db: deps.db });
  routes.get("/", {
    summary: "The project's audit log, newest first; page back with `before`",
    access: project("project:read"),
    params: ProjectParams,
    query: AuditQuery,
    response: z.array(AuditEntry),
    handler: ({ project, query }) => listAudit(deps.db, project.id, query),
  });
  return routes;
}
