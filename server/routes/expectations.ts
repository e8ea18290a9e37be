// /api/projects/:projectId/models/:modelId/expectations: the model's expectations (list, add, edit, remove, CSV
// import and export), the expectation-by-revision matrix, and starting a check of one revision.
import {
  CheckExpectationsBody,
  CheckStarted,
  ExpectationInput,
  ExpectationList,
  ExpectationMatrix,
  ExpectationParams,
  ExpectationsParams,
  ImportExpectationsBody,
  ImportExpectationsResult,
  StoredExpectation,
} from "@shared/schemas/expectations";
import { HttpError } from "../http/errors";
import { project, routeGroup, type RouteGroup } from "../http/route-group";
import type { LifecycleDeps } from "../jobs/run-lifecycle";
import { startExpectationCheck } from "../services/expectations/expectation-check";
import { expectationMatrix } from "../services/expectations/expectation-matrix";
import {
  addExpectation,
  editExpectation,
  exportExpectations,
  importExpectations,
  modelExpectations,
  removeExpectation,
} from "../services/expectations/expectations-table";

export function expectationsRoutes(runs: LifecycleDeps): RouteGroup {
  const { db } = runs;
  const routes = routeGroup({
    mountPath: "/projects/:projectId/models/:modelId/expectations",
    tag: "expectations",
    db,
  });
  const read = project("project:read");
  const write = project("model:write");
  const actor = (params: { projectId: string; modelId: string }, userId: string) => ({ ...params, userId });

  routes.get("/", {
    summary: "List the model's expectations",
    access: read,
    params: ExpectationsParams,
    response: ExpectationList,
    handler: ({ params }) => modelExpectations(db, params),
  });

  routes.post("/", {
    summary: "Add an expectation (then check the latest revision in the background)",
    access: write,
    params: ExpectationsParams,
    body: ExpectationInput,
    response: StoredExpectation,
    status: 201,
    handler: ({ params, body, user }) => addExpectation(runs, actor(params, user.id), body),
  });

  routes.get("/export", {
    summary: "Download the expectations as CSV (docs/expectations-csv.md)",
    access: read,
    params: ExpectationsParams,
    produces: "text/csv",
    async handler({ params, res }) {
      const csv = await exportExpectations(db, params);
      res.attachment("expectations.csv");
      res.setHeader("Content-Type", "text/csv; charset=utf-8");
      res.send(csv);
    },
  });

  routes.post("/import", {
    summary: "Import a CSV table: every error with its line and column, and nothing stored unless all rows read",
    access: write,
    params: ExpectationsParams,
    body: ImportExpectationsBody,
    response: ImportExpectationsResult,
    handler: ({ params, body, user }) => importExpectations(runs, actor(params, user.id), body.csv, body.mode),
  });

  routes.get("/matrix", {
    summary: "Every expectation against every revision: pass, fail or undecided with the reason, and breaks",
    access: read,
    params: ExpectationsParams,
    response: ExpectationMatrix,
    handler: ({ params }) => expectationMatrix(db, params.projectId, params.modelId),
  });

  routes.post("/check", {
    summary: "Check a revision (the latest by default) against every expectation, as a run",
    access: project("run:start"),
    params: ExpectationsParams,
    body: CheckExpectationsBody,
    response: CheckStarted,
    async handler({ params, body, user }) {
      const q = db("model_revisions as r")
        .join("models as m", "m.id", "r.model_id")
        .where({ "m.id": params.modelId, "m.project_id": params.projectId });
      if (body.revision) q.where("r.revision", body.revision);
      else q.whereRaw("r.revision = m.latest_revision");
      const revision = (await q.first("r.id")) as { id: string } | undefined;
      if (!revision) throw new HttpError(404, "NOT_FOUND", "No such model revision in this project");
      const started = await startExpectationCheck(runs, {
        ...params,
        revisionId: revision.id,
        startedBy: user.id,
      });
      return { runId: started?.runId ?? null, reused: started?.reused ?? false };
    },
  });

  routes.patch("/:expectationId", {
    summary: "Edit an expectation (then check the latest revision in the background)",
    access: write,
    params: ExpectationParams,
    body: ExpectationInput,
    response: StoredExpectation,
    handler: ({ params, body, user }) => editExpectation(runs, actor(params, user.id), params.expectationId, body),
  });

  routes.delete("/:expectationId", {
    summary: "Remove an expectation and its results",
    access: write,
    params: ExpectationParams,
    status: 204,
    handler: ({ params, user }) => removeExpectation(db, actor(params, user.id), params.expectationId),
  });

  return routes;
}
