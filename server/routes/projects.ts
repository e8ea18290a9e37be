// Projects: the caller's list, create, read, rename/archive, and delete with the name typed as confirmation.
import type { Knex } from "knex";
import type { Logger } from "pino";
import { z } from "zod";
import {
  CreateProjectBody,
  DeleteProjectBody,
  ProjectDetail,
  ProjectListItem,
  ProjectParams,
  UpdateProjectBody,
  type Project,
} from "@shared/schemas/projects";
import { capabilitiesOf } from "@shared/types/roles";
import { deleteProject, findProject, listProjectsFor } from "../db/repositories/projects";
import type { AuthUser, ProjectContext } from "../http/auth";
import { HttpError } from "../http/errors";
import { project, routeGroup, signedIn, type RouteGroup } from "../http/route-group";
import { changeProject, createProject } from "../services/projects/project-settings";

/** A project as the caller sees it: with their role and what it lets them do, so the client can hide the rest. */
function asSeenBy(p: Project, access: ProjectContext, user: AuthUser): ProjectDetail {
  return { ...p, role: access.role, siteRole: user.siteRole, capabilities: capabilitiesOf(access.role, user.siteRole) };
}

export function projectsRoutes(deps: { db: Knex; log: Logger }): RouteGroup {
  const { db } = deps;
  const routes = routeGroup({ mountPath: "/projects", tag: "projects", db });

  routes.get("/", {
    summary: "The projects the caller is a member of (every project for site administrators)",
    access: signedIn,
    response: z.array(ProjectListItem),
    async handler({ user, req }) {
      const all = await listProjectsFor(db, user);
      const limit = req.accessToken?.projectIds;
      return limit ? all.filter((p) => limit.includes(p.id)) : all;
    },
  });

  routes.post("/", {
    summary: "Create a project with the caller as its owner",
    access: signedIn,
    body: CreateProjectBody,
    response: ProjectListItem,
    status: 201,
    handler({ body, user, req }) {
      if (req.accessToken?.projectIds)
        throw new HttpError(403, "TOKEN_NOT_ALLOWED", "A token limited to chosen projects cannot create projects");
      return createProject(db, user.id, body);
    },
  });

  routes.get("/:projectId", {
    summary: "Read a project with the caller's role and capabilities in it",
    access: project("project:read"),
    params: ProjectParams,
    response: ProjectDetail,
    async handler({ project, user }) {
      const found = await findProject(db, project.id);
      if (!found) throw new HttpError(404, "NOT_FOUND", "No such project");
      return asSeenBy(found, project, user);
    },
  });

  routes.patch("/:projectId", {
    summary: "Rename, describe, archive or restore a project",
    access: project("project:manage"),
    params: ProjectParams,
    body: UpdateProjectBody,
    response: ProjectDetail,
    handler: async ({ body, project, user }) =>
      asSeenBy(await changeProject(db, user.id, project, body), project, user),
  });

  routes.delete("/:projectId", {
    summary: "Delete a project and everything in it; the body repeats its name as confirmation",
    access: project("project:manage"),
    params: ProjectParams,
    body: DeleteProjectBody,
    status: 204,
    async handler({ body, project, user, req }) {
      if (body.confirmName !== project.name) {
        throw new HttpError(400, "CONFIRMATION_MISMATCH", "Type the project's name exactly to confirm deleting it");
      }
      await deleteProject(db, project.id);
      // The project's audit log goes with it, so the operator's log is where a deletion stays on record.
      deps.log.info(
        { projectId: project.id, projectName: project.name, actorId: user.id, requestId: req.id },
        "project deleted",
      );
    },
  });

  return routes;
}
