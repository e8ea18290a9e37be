// /api/projects/:projectId/reductions: stored reductions, their certificates and their review (decisions,
// re-verification, threaded comments), uploads of certificates found elsewhere, and searches, which are runs.
// The work is in server/services/reductions; these handlers parse, call it and answer.
import type { Knex } from "knex";
import { z } from "zod";
import { ProjectParams } from "@shared/schemas/projects";
import {
  BulkDecisionBody,
  BulkDecisionResult,
  Certificate,
  CommentBody,
  DecisionBody,
  ReductionDetail,
  ReductionList,
  ReductionListQuery,
  ReductionParams,
  ProposeFindingBody,
  SaveReducedModelBody,
  SavedReducedModel,
  SaveTargetBody,
  SearchBody,
} from "@shared/schemas/reductions";
import { StartRunResponse } from "@shared/schemas/runs";
import { listReductions } from "../db/repositories/reductions";
import { project, reply, routeGroup, type RouteGroup } from "../http/route-group";
import type { RunQueue } from "../jobs/run-queue";
import { notifyReviewWaiting, type NotifyPeopleDeps } from "../services/notifications/notify-people";
import { proposeFinding } from "../services/reductions/propose-finding";
import {
  commentOnReduction,
  decideReduction,
  decideReductions,
  reductionOf,
  reverifyReduction,
} from "../services/reductions/review";
import { saveReducedModel } from "../services/reductions/save-reduced-model";
import { saveTargetAsModel } from "../services/reductions/save-target";
import { startSearch } from "../services/reductions/start-search";
import { uploadCertificate } from "../services/reductions/upload-certificate";

const UploadBody = z.object({ sourceModelId: z.uuid(), targetModelId: z.uuid().optional(), certificate: Certificate });

export function reductionsRoutes(deps: {
  db: Knex;
  queue: RunQueue;
  queueCap: number;
  /** Who is told about decisions, waiting reviews and mentions (in the app, and by e-mail when they chose it). */
  notify?: NotifyPeopleDeps;
}): RouteGroup {
  const { db, notify } = deps;
  const routes = routeGroup({ mountPath: "/projects/:projectId/reductions", tag: "reductions", db });

  routes.post("/searches", {
    summary: "Start a reduction search as a run (or answer the stored run of the same search)",
    access: project("run:start"),
    params: ProjectParams,
    body: SearchBody,
    response: StartRunResponse,
    status: [201, 200],
    async handler({ body, project, user }) {
      const out = await startSearch(deps, { projectId: project.id, userId: user.id }, body);
      return reply(out.reused ? 200 : 201, { ...out.run, reused: out.reused });
    },
  });

  routes.get("/", {
    summary: "List the project's reductions, newest first, by review state, notion or source model",
    access: project("project:read"),
    params: ProjectParams,
    query: ReductionListQuery,
    response: ReductionList,
    handler: ({ project, query }) => listReductions(db, project.id, query),
  });

  routes.post("/", {
    summary: "Submit a certificate found elsewhere; it is stored as proposed only if it verifies",
    access: project("run:start"),
    params: ProjectParams,
    body: UploadBody,
    response: ReductionDetail,
    status: [201, 200],
    async handler({ body, project, user }) {
      const { reduction, isNew } = await uploadCertificate(db, { projectId: project.id, user }, body);
      if (isNew && notify)
        await notifyReviewWaiting(notify, project.id, user.id, 1, `${user.displayName} submitted a certificate.`);
      return reply(isNew ? 201 : 200, reduction);
    },
  });

  routes.post("/proposals", {
    summary: "Propose one finding a search kept on its run (by run and rank) for review",
    access: project("run:start"),
    params: ProjectParams,
    body: ProposeFindingBody,
    response: ReductionDetail,
    status: [201, 200],
    async handler({ body, project, user }) {
      const { reduction, isNew } = await proposeFinding(db, { projectId: project.id, user }, body);
      if (isNew && notify)
        await notifyReviewWaiting(notify, project.id, user.id, 1, `${user.displayName} proposed a search finding.`);
      return reply(isNew ? 201 : 200, reduction);
    },
  });

  routes.post("/reduced-models", {
    summary: "Save a node-elimination run's reduced network as a new model, proposed as a reduction of its source",
    access: project("model:write"),
    params: ProjectParams,
    body: SaveReducedModelBody,
    response: SavedReducedModel,
    status: 201,
    async handler({ body, project, user }) {
      const saved = await saveReducedModel(db, { projectId: project.id, user }, body);
      if (notify)
        await notifyReviewWaiting(notify, project.id, user.id, 1, `${user.displayName} saved a reduced model.`);
      return reply(201, saved);
    },
  });

  routes.post("/decisions", {
    summary: "Approve or reject many reductions at once; rejecting needs a reason",
    access: project("review:decide"),
    params: ProjectParams,
    body: BulkDecisionBody,
    response: BulkDecisionResult,
    handler: ({ body, project, user }) => decideReductions(db, { projectId: project.id, user }, body, notify),
  });

  routes.get("/:reductionId", {
    summary: "Read a reduction with its certificate, review events and comments",
    access: project("project:read"),
    params: ReductionParams,
    response: ReductionDetail,
    handler: ({ params }) => reductionOf(db, params.projectId, params.reductionId),
  });

  routes.get("/:reductionId/certificate", {
    summary: "Download the reduction's certificate as JSON",
    access: project("project:read"),
    params: ReductionParams,
    produces: "application/json",
    async handler({ params, res }) {
      const r = await reductionOf(db, params.projectId, params.reductionId);
      res.setHeader("Content-Disposition", `attachment; filename="reduction-${r.id}.json"`);
      res.type("application/json").send(JSON.stringify(r.certificate, null, 2));
    },
  });

  routes.post("/:reductionId/decision", {
    summary: "Approve (after re-verifying) or reject a reduction",
    access: project("review:decide"),
    params: ReductionParams,
    body: DecisionBody,
    response: ReductionDetail,
    handler: ({ params, body, project, user }) =>
      decideReduction(db, { projectId: project.id, user }, params.reductionId, body, notify),
  });

  routes.post("/:reductionId/verify", {
    summary: "Re-run the independent verifier on the certificate and record the outcome",
    access: project("review:decide"),
    params: ReductionParams,
    response: ReductionDetail,
    handler: ({ params, project, user }) => reverifyReduction(db, { projectId: project.id, user }, params.reductionId),
  });

  routes.post("/:reductionId/comments", {
    summary: "Comment on a reduction, or answer a comment",
    access: project("comment:write"),
    params: ReductionParams,
    body: CommentBody,
    response: ReductionDetail,
    status: 201,
    handler: ({ params, body, project, user }) =>
      commentOnReduction(db, { projectId: project.id, user }, params.reductionId, body, notify),
  });

  routes.post("/:reductionId/save-target", {
    summary: "Store a discovered target as a new model of the project",
    access: project("model:write"),
    params: ReductionParams,
    body: SaveTargetBody,
    response: ReductionDetail,
    status: 201,
    handler: ({ params, body, project, user }) =>
      saveTargetAsModel(db, { projectId: project.id, user }, params.reductionId, body.name),
  });

  return routes;
}
