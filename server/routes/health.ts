// Liveness plus a real round trip to PostgreSQL, so "up" means the product can actually serve data.
import type { Knex } from "knex";
import { Health } from "@shared/schemas/health";
import { anyone, reply, routeGroup, type RouteGroup } from "../http/route-group";

export function healthRoutes(deps: { db: Knex }): RouteGroup {
  const routes = routeGroup({ mountPath: "/health", tag: "health", db: deps.db });
  routes.get("/", {
    summary: "Whether the server and its database answer (503 when the database does not)",
    access: anyone,
    response: Health,
    // A degraded answer is still an answer: the same body, with 503 so load balancers take the instance out.
    status: [200, 503],
    async handler() {
      const started = Date.now();
      let database: Health["database"];
      try {
        await deps.db.raw("select 1");
        database = { status: "up", latencyMs: Date.now() - started };
      } catch (err) {
        database = { status: "down", message: (err as Error).message };
      }
      const up = database.status === "up";
      return reply(up ? 200 : 503, { status: up ? "ok" : "degraded", database });
    },
  });
  return routes;
}
