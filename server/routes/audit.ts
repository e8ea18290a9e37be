// A project's audit log, newest first.
import { Router } from "express";
import type { Knex } from "knex";
import { AuditQuery } from "@shared/schemas/projects";
import { listAudit } from "../db/repositories/audit-log";
import { currentProject, projectAccess } from "../http/auth";
import { validate } from "../http/validate";

export function auditRouter(deps: { db: Knex }): Router {
  const router = Router({ mergeParams: true });
  router.get("/", projectAccess(deps.db, "project:read"), validate({ query: AuditQuery }), async (req, res) => {
    const query = req.query as unknown as { limit: number; before?: string };
    res.json({ data: await listAudit(deps.db, currentProject(req).id, query) });
  });
  return router;
}
