// /api/projects/:projectId/model-hierarchy: the graph of the project's models joined by approved reductions.
import type { Knex } from "knex";
import { ProjectParams } from "@shared/schemas/projects";
import { HierarchyGraph } from "@shared/schemas/reductions";
import { project, routeGroup, type RouteGroup } from "../http/route-group";
import { projectModelHierarchy } from "../services/reductions/model-hierarchy";

export function modelHierarchyRoutes(deps: { db: Knex }): RouteGroup {
  const routes = routeGroup({ mountPath: "/projects/:projectId/model-hierarchy", tag: "reductions", db: deps.db });
  routes.get("/", {
    summary: "The project's models joined by approved reductions, closed under verified composition",
    access: project("project:read"),
    params: ProjectParams,
    response: HierarchyGraph,
    handler: ({ project }) => projectModelHierarchy(deps.db, project.id),
  });
  return routes;
}
