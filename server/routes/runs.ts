// A project's runs: start (or reuse a stored result), list with filters, read one, cancel, retry, delete.
// The work itself happens in worker processes; these handlers only write rows and send queue jobs.
import { Router, type Request } from "express";
import type { Knex } from "knex";
import { RunListQuery, RunParamsPath, StartRunBody, type Run } from "@shared/schemas/runs";
import { recordAudit } from "../db/repositories/audit-log";
import { getRun, listRuns } from "../db/repositories/runs";
import { currentProject, currentUser, projectAccess } from "../http/auth";
import { HttpError } from "../http/errors";
import { validate } from "../http/validate";
import { RunRequestError } from "../jobs/run-errors";
import { cancelRun, removeRun, retryRun, submitRun } from "../jobs/run-lifecycle";
import type { RunQueue } from "../jobs/run-queue";

export interface RunsRouterDeps {
  db: Knex;
  queue: RunQueue;
  queueCap: number;
}

const asHttp = (err: unknown) =>
  err instanceof RunRequestError ? new HttpError(err.status, err.code, err.message) : err;

export function runsRouter(deps: RunsRouterDeps): Router {
  const { db } = deps;
  const router = Router({ mergeParams: true });

  const runOf = async (req: Request): Promise<Run> => {
    const { runId } = req.params as { runId: string };
    const run = await getRun(db, runId, currentProject(req).id);
    if (!run) throw new HttpError(404, "NOT_FOUND", "No such run in this project");
    return run;
  };

  router.post("/", projectAccess(db, "run:start"), validate({ body: StartRunBody }), async (req, res) => {
    const project = currentProject(req);
    const user = currentUser(req);
    const body = req.body as StartRunBody;
    // Its parameters (revision ids, rule texts) are trusted by the merge step, so only the server may assemble them.
    if (body.kind === "reduction-search") {
      throw new HttpError(
        400,
        "INVALID_INPUT",
        "body.kind: start reduction searches with POST /api/projects/:projectId/reductions/searches",
        [{ field: "body.kind", message: "use the reductions searches endpoint" }],
      );
    }
    const out = await submitRun(deps, { projectId: project.id, startedBy: user.id, body }).catch((err) => {
      throw asHttp(err);
    });
    if (!out.reused) {
      await recordAudit(db, {
        projectId: project.id,
        actorId: user.id,
        action: "run.start",
        target: out.run.id,
        details: { kind: out.run.kind },
      });
    }
    res.status(out.reused ? 200 : 201).json({ data: { ...out.run, reused: out.reused } });
  });

  router.get("/", projectAccess(db, "project:read"), validate({ query: RunListQuery }), async (req, res) => {
    res.json({ data: await listRuns(db, currentProject(req).id, req.query as unknown as RunListQuery) });
  });

  router.get("/:runId", projectAccess(db, "project:read"), validate({ params: RunParamsPath }), async (req, res) => {
    res.json({ data: await runOf(req) });
  });

  router.post(
    "/:runId/cancel",
    projectAccess(db, "run:start"),
    validate({ params: RunParamsPath }),
    async (req, res) => {
      const run = await runOf(req);
      const cancelled = await cancelRun(deps, run, currentUser(req)).catch((err) => {
        throw asHttp(err);
      });
      await recordAudit(db, {
        projectId: run.projectId,
        actorId: currentUser(req).id,
        action: "run.cancel",
        target: run.id,
        details: { kind: run.kind },
      });
      res.json({ data: cancelled });
    },
  );

  router.post(
    "/:runId/retry",
    projectAccess(db, "run:start"),
    validate({ params: RunParamsPath }),
    async (req, res) => {
      const run = await runOf(req);
      const retried = await retryRun(deps, run).catch((err) => {
        throw asHttp(err);
      });
      await recordAudit(db, {
        projectId: run.projectId,
        actorId: currentUser(req).id,
        action: "run.retry",
        target: run.id,
        details: { kind: run.kind },
      });
      res.json({ data: retried });
    },
  );

  router.delete("/:runId", projectAccess(db, "run:start"), validate({ params: RunParamsPath }), async (req, res) => {
    const run = await runOf(req);
    await removeRun(deps, run);
    await recordAudit(db, {
      projectId: run.projectId,
      actorId: currentUser(req).id,
      action: "run.delete",
      target: run.id,
      details: { kind: run.kind, state: run.state },
    });
    res.status(204).end();
  });

  return router;
}
