// Liveness plus a real round trip to PostgreSQL, so "up" means the product can actually serve data.
import { Router } from "express";
import type { Knex } from "knex";

export function healthRouter(deps: { db: Knex }): Router {
  const router = Router();
  router.get("/", async (_req, res) => {
    const started = Date.now();
    let database: { status: "up" | "down"; latencyMs?: number; message?: string };
    try {
      await deps.db.raw("select 1");
      database = { status: "up", latencyMs: Date.now() - started };
    } catch (err) {
      database = { status: "down", message: (err as Error).message };
    }
    res
      .status(database.status === "up" ? 200 : 503)
      .json({ data: { status: database.status === "up" ? "ok" : "degraded", database } });
  });
  return router;
}
