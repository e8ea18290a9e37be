// A project's members: list, change a role, remove. A project always keeps at least one owner.
import type { Knex } from "knex";
import { z } from "zod";
import { ChangeRoleBody, Member, MemberParams, ProjectParams } from "@shared/schemas/projects";
import { recordAudit } from "../db/repositories/audit-log";
import { deleteMembership, findMember, listMembers, lockOwners, setRole } from "../db/repositories/memberships";
import { HttpError } from "../http/errors";
import { project, routeGroup, type RouteGroup } from "../http/route-group";

const lastOwner = () =>
  new HttpError(409, "LAST_OWNER", "A project needs at least one owner: make someone else owner first");
const notAMember = () => new HttpError(404, "NOT_FOUND", "That person is not a member of this project");

export function membersRoutes(deps: { db: Knex }): RouteGroup {
  const { db } = deps;
  const routes = routeGroup({ mountPath: "/projects/:projectId/members", tag: "members", db });

  routes.get("/", {
    summary: "List the project's members with their roles",
    access: project("project:read"),
    params: ProjectParams,
    response: z.array(Member),
    handler: ({ project }) => listMembers(db, project.id),
  });

  routes.patch("/:userId", {
    summary: "Change a member's role",
    access: project("project:manage"),
    params: MemberParams,
    body: ChangeRoleBody,
    response: Member,
    handler: ({ params, body, project, user }) =>
      db.transaction(async (trx) => {
        const owners = await lockOwners(trx, project.id);
        const before = await findMember(trx, project.id, params.userId);
        if (!before) throw notAMember();
        if (before.role === body.role) return before;
        if (before.role === "owner" && owners.length === 1) throw lastOwner();
        await setRole(trx, project.id, params.userId, body.role);
        await recordAudit(trx, {
          projectId: project.id,
          actorId: user.id,
          action: "member.role",
          target: before.email,
          details: { from: before.role, to: body.role },
        });
        return { ...before, role: body.role };
      }),
  });

  routes.delete("/:userId", {
    summary: "Remove a member from the project",
    access: project("project:manage"),
    params: MemberParams,
    status: 204,
    handler: ({ params, project, user }) =>
      db.transaction(async (trx) => {
        const owners = await lockOwners(trx, project.id);
        const member = await findMember(trx, project.id, params.userId);
        if (!member) throw notAMember();
        if (member.role === "owner" && owners.length === 1) throw lastOwner();
        await deleteMembership(trx, project.id, params.userId);
        await recordAudit(trx, {
          projectId: project.id,
          actorId: user.id,
          action: "member.remove",
          target: member.email,
          details: { role: member.role },
        });
      }),
  });

  return routes;
}
