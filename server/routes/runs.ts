// A project's runs: start (or reuse a stored result), list with filters, read one, cancel, retry, delete.
// The work itself happens in worker processes; these handlers only write rows and send queue jobs.
import type { Knex } from "knex";
import { ProjectParams } from "@shared/schemas/projects";
import { RunList, RunListQuery, RunParamsPath, Run, StartRunBody, StartRunResponse } from "@shared/schemas/runs";
import { getRun, listRuns, withQueuePositions } from "../db/repositories/runs";
import { HttpError } from "../http/errors";
import { project, reply, routeGroup, type RouteGroup } from "../http/route-group";
import { cancelRun, removeRun, retryRun, submitRun } from "../jobs/run-lifecycle";
import type { RunQueue } from "../jobs/run-queue";

export interface RunsRouterDeps {
  db: Knex;
  queue: RunQueue;
  queueCap: number;
}

export function runsRoutes(deps: RunsRouterDeps): RouteGroup {
  const { db } = deps;
  const routes = routeGroup({ mountPath: "/projects/:projectId/runs", tag: "runs", db });

  const runOf = async (projectId: string, runId: string) => {
    const run = await getRun(db, runId, projectId);
    if (!run) throw new HttpError(404, "NOT_FOUND", "No such run in this project");
    return run;
  };

  routes.post("/", {
    summary: "Start a run, or answer the stored run of the same kind, revision and parameters",
    access: project("run:start"),
    params: ProjectParams,
    body: StartRunBody,
    response: StartRunResponse,
    status: [201, 200],
    async handler({ body, project, user }) {
      // Its parameters (revision ids, rule texts) are trusted by the merge step, so only the server may assemble them.
      if (body.kind === "reduction-search") {
        throw new HttpError(
          400,
          "INVALID_INPUT",
          "body.kind: start reduction searches with POST /api/projects/:projectId/reductions/searches",
          [{ field: "body.kind", message: "use the reductions searches endpoint" }],
        );
      }
      const out = await submitRun(deps, {
        projectId: project.id,
        startedBy: user.id,
        body,
        audit: { action: "run.start", details: { kind: body.kind } },
      });
      const [run] = await withQueuePositions(db, [out.run]);
      return reply(out.reused ? 200 : 201, { ...run!, reused: out.reused });
    },
  });

  routes.get("/", {
    summary: "List the project's runs, newest first",
    access: project("project:read"),
    params: ProjectParams,
    query: RunListQuery,
    response: RunList,
    handler: async ({ project, query }) => withQueuePositions(db, await listRuns(db, project.id, query)),
  });

  routes.get("/:runId", {
    summary: "Read one run with its progress, result or error",
    access: project("project:read"),
    params: RunParamsPath,
    response: Run,
    handler: async ({ params }) => (await withQueuePositions(db, [await runOf(params.projectId, params.runId)]))[0]!,
  });

  routes.post("/:runId/cancel", {
    summary: "Cancel a queued or running run",
    access: project("run:start"),
    params: RunParamsPath,
    response: Run,
    handler: async ({ params, user }) => cancelRun(deps, await runOf(params.projectId, params.runId), user),
  });

  routes.post("/:runId/retry", {
    summary: "Run a failed or cancelled run again, resuming its shards from their checkpoints",
    access: project("run:start"),
    params: RunParamsPath,
    response: Run,
    handler: async ({ params, user }) => retryRun(deps, await runOf(params.projectId, params.runId), user),
  });

  routes.delete("/:runId", {
    summary: "Delete a run and its stored result",
    access: project("run:start"),
    params: RunParamsPath,
    status: 204,
    handler: async ({ params, user }) => removeRun(deps, await runOf(params.projectId, params.runId), user),
  });

  return routes;
}
