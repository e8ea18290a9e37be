// Projects: the caller's list, create, read, rename/archive, and delete with the name typed as confirmation.
import { Router } from "express";
import type { Knex } from "knex";
import type { Logger } from "pino";
import { CreateProjectBody, DeleteProjectBody, UpdateProjectBody } from "@shared/schemas/projects";
import { capabilitiesOf } from "@shared/types/roles";
import { recordAudit } from "../db/repositories/audit-log";
import { upsertMembership } from "../db/repositories/memberships";
import { deleteProject, findProject, insertProject, listProjectsFor, updateProject } from "../db/repositories/projects";
import { currentProject, currentUser, projectAccess, requireUser } from "../http/auth";
import { HttpError } from "../http/errors";
import { validate } from "../http/validate";

export function projectsRouter(deps: { db: Knex; log: Logger }): Router {
  const { db } = deps;
  const router = Router();

  router.get("/", requireUser, async (req, res) => {
    res.json({ data: await listProjectsFor(db, currentUser(req)) });
  });

  router.post("/", requireUser, validate({ body: CreateProjectBody }), async (req, res) => {
    const body = req.body as { name: string; description: string };
    const user = currentUser(req);
    const project = await db.transaction(async (trx) => {
      const p = await insertProject(trx, { name: body.name, description: body.description, createdBy: user.id });
      await upsertMembership(trx, p.id, user.id, "owner");
      await recordAudit(trx, { projectId: p.id, actorId: user.id, action: "project.create", target: p.name });
      return p;
    });
    res.status(201).json({ data: { ...project, role: "owner", memberCount: 1 } });
  });

  router.get("/:projectId", projectAccess(db, "project:read"), async (req, res) => {
    const access = currentProject(req);
    const user = currentUser(req);
    const project = await findProject(db, access.id);
    if (!project) throw new HttpError(404, "NOT_FOUND", "No such project");
    res.json({
      data: {
        ...project,
        role: access.role,
        siteRole: user.siteRole,
        capabilities: capabilitiesOf(access.role, user.siteRole),
      },
    });
  });

  router.patch(
    "/:projectId",
    projectAccess(db, "project:manage"),
    validate({ body: UpdateProjectBody }),
    async (req, res) => {
      const body = req.body as UpdateProjectBody;
      const access = currentProject(req);
      const user = currentUser(req);
      const project = await db.transaction(async (trx) => {
        const updated = await updateProject(trx, access.id, body);
        if (body.name !== undefined && body.name !== access.name) {
          await recordAudit(trx, {
            projectId: access.id,
            actorId: user.id,
            action: "project.rename",
            target: body.name,
            details: { from: access.name },
          });
        }
        if (body.description !== undefined)
          await recordAudit(trx, { projectId: access.id, actorId: user.id, action: "project.describe" });
        if (body.archived !== undefined && body.archived !== access.archived) {
          await recordAudit(trx, {
            projectId: access.id,
            actorId: user.id,
            action: body.archived ? "project.archive" : "project.restore",
            target: updated.name,
          });
        }
        return updated;
      });
      res.json({
        data: {
          ...project,
          role: access.role,
          siteRole: user.siteRole,
          capabilities: capabilitiesOf(access.role, user.siteRole),
        },
      });
    },
  );

  router.delete(
    "/:projectId",
    projectAccess(db, "project:manage"),
    validate({ body: DeleteProjectBody }),
    async (req, res) => {
      const body = req.body as DeleteProjectBody;
      const access = currentProject(req);
      if (body.confirmName !== access.name) {
        throw new HttpError(400, "CONFIRMATION_MISMATCH", "Type the project's name exactly to confirm deleting it");
      }
      await deleteProject(db, access.id);
      // The project's audit log goes with it, so the operator's log is where a deletion stays on record.
      deps.log.info(
        { projectId: access.id, projectName: access.name, actorId: currentUser(req).id, requestId: req.id },
        "project deleted",
      );
      res.status(204).end();
    },
  );

  return router;
}
