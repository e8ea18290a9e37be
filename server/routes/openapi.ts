// The API's own description, built once from the route registry of the app that serves it.
import type { Express } from "express";
import type { Knex } from "knex";
import { openApiDocument } from "../http/openapi";
import { anyone, routeGroup, type RouteGroup } from "../http/route-group";
import { routeRegistry } from "../http/route-registry";

export function openApiRoutes(deps: { db: Knex }): RouteGroup {
  const routes = routeGroup({ mountPath: "/openapi.json", tag: "documentation", db: deps.db });
  let document: object | undefined;
  routes.get("/", {
    summary: "This API described as an OpenAPI 3.1 document",
    access: anyone,
    produces: "application/json",
    handler({ req, res }) {
      document ??= openApiDocument(routeRegistry(req.app as Express).routes, { version: "0.1.0" });
      res.json(document);
    },
  });
  return routes;
}
