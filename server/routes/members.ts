// A project's members: list, change a role, remove. A project always keeps at least one owner.
import { Router } from "express";
import type { Knex } from "knex";
import { ChangeRoleBody, MemberParams } from "@shared/schemas/projects";
import { recordAudit } from "../db/repositories/audit-log";
import { deleteMembership, findMember, listMembers, lockOwners, setRole } from "../db/repositories/memberships";
import { currentProject, currentUser, projectAccess } from "../http/auth";
import { HttpError } from "../http/errors";
import { validate } from "../http/validate";

const lastOwner = () =>
  new HttpError(409, "LAST_OWNER", "A project needs at least one owner: make someone else owner first");

export function membersRouter(deps: { db: Knex }): Router {
  const { db } = deps;
  const router = Router({ mergeParams: true });

  router.get("/", projectAccess(db, "project:read"), async (req, res) => {
    res.json({ data: await listMembers(db, currentProject(req).id) });
  });

  router.patch(
    "/:userId",
    projectAccess(db, "project:manage"),
    validate({ params: MemberParams, body: ChangeRoleBody }),
    async (req, res) => {
      const { userId } = req.params as { userId: string };
      const { role } = req.body as ChangeRoleBody;
      const project = currentProject(req);
      const actor = currentUser(req);
      const member = await db.transaction(async (trx) => {
        const owners = await lockOwners(trx, project.id);
        const before = await findMember(trx, project.id, userId);
        if (!before) throw new HttpError(404, "NOT_FOUND", "That person is not a member of this project");
        if (before.role === role) return before;
        if (before.role === "owner" && owners.length === 1) throw lastOwner();
        await setRole(trx, project.id, userId, role);
        await recordAudit(trx, {
          projectId: project.id,
          actorId: actor.id,
          action: "member.role",
          target: before.email,
          details: { from: before.role, to: role },
        });
        return { ...before, role };
      });
      res.json({ data: member });
    },
  );

  router.delete(
    "/:userId",
    projectAccess(db, "project:manage"),
    validate({ params: MemberParams }),
    async (req, res) => {
      const { userId } = req.params as { userId: string };
      const project = currentProject(req);
      const actor = currentUser(req);
      await db.transaction(async (trx) => {
        const owners = await lockOwners(trx, project.id);
        const member = await findMember(trx, project.id, userId);
        if (!member) throw new HttpError(404, "NOT_FOUND", "That person is not a member of this project");
        if (member.role === "owner" && owners.length === 1) throw lastOwner();
        await deleteMembership(trx, project.id, userId);
        await recordAudit(trx, {
          projectId: project.id,
          actorId: actor.id,
          action: "member.remove",
          target: member.email,
          details: { role: member.role },
        });
      });
      res.status(204).end();
    },
  );

  return router;
}
