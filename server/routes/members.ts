// A project's members: list, change a role, remove. A project always keeps at least one owner.
import type { Knex } from "knex";
import { z } from "zod";
import { ChangeRoleBody, Member, MemberParams, ProjectParams } from "@shared/schemas/projects";
import { listMembers } from "../db/repositories/memberships";
import { project, routeGroup, type RouteGroup } from "../http/route-group";
import { changeRole, removeMember } from "../services/projects/memberships";

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
      changeRole(db, { projectId: project.id, actorId: user.id }, params.userId, body.role),
  });

  routes.delete("/:userId", {
    summary: "Remove a member from the project",
    access: project("project:manage"),
    params: MemberParams,
    status: 204,
    handler: ({ params, project, user }) =>
      removeMember(db, { projectId: project.id, actorId: user.id }, params.userId),
  });

  return routes;
}
