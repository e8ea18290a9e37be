// /api/projects/:projectId/reductions: stored reductions, their certificates and their review (decisions,
// re-verification, threaded comments). Every change is written with its audit entry in one transaction.
import { Router } from "express";
import type { Knex } from "knex";
import { z } from "zod";
import { networkFromCertificate, networkToCertificate } from "@shared/engine/certificates";
import { networkToDefinition, printRuleText } from "@shared/engine/rules";
import {
  Certificate,
  CommentBody,
  DecisionBody,
  ReductionListQuery,
  ReductionParams,
  SaveTargetBody,
  SearchBody,
} from "@shared/schemas/reductions";
import { recordAudit } from "../db/repositories/audit-log";
import {
  commentBelongsTo,
  findReduction,
  insertComment,
  insertEvent,
  insertReduction,
  listReductions,
  setReviewState,
  setTargetRevision,
  setVerification,
} from "../db/repositories/reductions";
import { findRevision, insertRevision } from "../db/repositories/model-revisions";
import { insertModel } from "../db/repositories/models";
import { currentProject, currentUser, projectAccess } from "../http/auth";
import { HttpError } from "../http/errors";
import { validate } from "../http/validate";
import { RunRequestError } from "../jobs/run-errors";
import { submitRun } from "../jobs/run-lifecycle";
import type { RunQueue } from "../jobs/run-queue";
import { networkSummary } from "../models/network-summary";
import { latestRevisionNetwork, type RevisionNetwork } from "../reductions/revision-network";
import { checkCertificate } from "../reductions/check-certificate";
import { statementKey } from "../reductions/statement-key";

const ProjectParams = z.object({ projectId: z.uuid() });
const UploadBody = z.object({ sourceModelId: z.uuid(), targetModelId: z.uuid().optional(), certificate: Certificate });

/** Largest sources the tabulating notions accept (2^22 states in typed arrays); block emulation has no such bound. */
const MAX_TABULATED_SOURCE_NODES = 22;
const MAX_TARGET_NODES = 12;

/** Checks what zod cannot: sizes the engine accepts and node names that must exist in the source. */
function checkSearch(search: SearchBody, source: RevisionNetwork, target: RevisionNetwork | null): void {
  const n = source.network.names.length;
  const tabulates =
    search.mode === "coarse-grain" || (search.mode === "given-target" && search.notion === "dynamical-embedding");
  if (tabulates && n > MAX_TABULATED_SOURCE_NODES) {
    throw new HttpError(
      400,
      "TOO_LARGE",
      `sourceModelId: "${source.modelName}" has ${n} nodes; this notion enumerates all states and accepts at most ${MAX_TABULATED_SOURCE_NODES}`,
    );
  }
  if (target && target.network.names.length > MAX_TARGET_NODES) {
    throw new HttpError(
      400,
      "TOO_LARGE",
      `targetModelId: "${target.modelName}" has ${target.network.names.length} nodes; targets have at most ${MAX_TARGET_NODES}`,
    );
  }
  if (search.mode === "coarse-grain") {
    const missing = search.observe.filter((name) => !source.network.names.includes(name));
    if (missing.length)
      throw new HttpError(
        400,
        "INVALID_INPUT",
        `observe: ${missing.map((m) => `"${m}"`).join(", ")} ${missing.length > 1 ? "are not nodes" : "is not a node"} of "${source.modelName}"`,
        [{ field: "body.observe", message: "unknown node" }],
      );
  }
}

export function reductionsRouter(deps: { db: Knex; queue: RunQueue; queueCap: number }): Router {
  const { db } = deps;
  const router = Router({ mergeParams: true });

  // A search is a run of kind "reduction-search" on the source's latest revision; the networks are fixed at
  // submission (rule text in the parameters), so a later edit of either model cannot change what the run proves.
  router.post(
    "/searches",
    projectAccess(db, "run:start"),
    validate({ params: ProjectParams, body: SearchBody }),
    async (req, res) => {
      const search = req.body as z.infer<typeof SearchBody>;
      const project = currentProject(req);
      const user = currentUser(req);
      const source = await latestRevisionNetwork(db, project.id, search.sourceModelId, "sourceModelId");
      const target =
        search.mode === "given-target"
          ? await latestRevisionNetwork(db, project.id, search.targetModelId, "targetModelId")
          : null;
      checkSearch(search, source, target);
      const ruleTextOf = async (r: RevisionNetwork) => (await findRevision(db, r.modelId, r.revision))!.ruleText;
      const params = {
        search,
        sourceRevisionId: source.revisionId,
        targetRevisionId: target?.revisionId ?? null,
        sourceRuleText: await ruleTextOf(source),
        targetRuleText: target ? await ruleTextOf(target) : null,
      };
      const out = await submitRun(deps, {
        projectId: project.id,
        startedBy: user.id,
        body: { kind: "reduction-search", modelRevisionId: source.revisionId, params },
      }).catch((err) => {
        throw err instanceof RunRequestError ? new HttpError(err.status, err.code, err.message) : err;
      });
      if (!out.reused)
        await recordAudit(db, {
          projectId: project.id,
          actorId: user.id,
          action: "reduction.search",
          target: out.run.id,
          details: { mode: search.mode },
        });
      res.status(out.reused ? 200 : 201).json({ data: { ...out.run, reused: out.reused } });
    },
  );

  router.get(
    "/",
    projectAccess(db, "project:read"),
    validate({ params: ProjectParams, query: ReductionListQuery }),
    async (req, res) => {
      const q = req.query as z.infer<typeof ReductionListQuery>;
      res.json({ data: await listReductions(db, currentProject(req).id, q) });
    },
  );

  // A certificate found elsewhere (the command line, another installation) enters review like a search result, but
  // only if it verifies and its source is exactly the model's latest revision.
  router.post(
    "/",
    projectAccess(db, "run:start"),
    validate({ params: ProjectParams, body: UploadBody }),
    async (req, res) => {
      const body = req.body as z.infer<typeof UploadBody>;
      const project = currentProject(req);
      const user = currentUser(req);
      // Verification re-simulates every target state within this request; searches never produce larger targets.
      if (body.certificate.target.nodes.length > MAX_TARGET_NODES) {
        throw new HttpError(
          400,
          "TOO_LARGE",
          `certificate.target: it has ${body.certificate.target.nodes.length} nodes; targets have at most ${MAX_TARGET_NODES}`,
          [{ field: "body.certificate.target.nodes", message: `at most ${MAX_TARGET_NODES} nodes` }],
        );
      }
      const source = await latestRevisionNetwork(db, project.id, body.sourceModelId, "sourceModelId");
      if (JSON.stringify(networkToCertificate(source.network)) !== JSON.stringify(body.certificate.source)) {
        throw new HttpError(
          400,
          "SOURCE_MISMATCH",
          `certificate.source: it is not the network of "${source.modelName}" revision ${source.revision}`,
        );
      }
      let targetRevisionId: string | null = null;
      if (body.targetModelId) {
        const target = await latestRevisionNetwork(db, project.id, body.targetModelId, "targetModelId");
        if (JSON.stringify(networkToCertificate(target.network)) !== JSON.stringify(body.certificate.target)) {
          throw new HttpError(
            400,
            "TARGET_MISMATCH",
            `certificate.target: it is not the network of "${target.modelName}" revision ${target.revision}`,
          );
        }
        targetRevisionId = target.revisionId;
      }
      const verification = checkCertificate(body.certificate, { id: user.id, displayName: user.displayName });
      if (!verification.isValid)
        throw new HttpError(400, "INVALID_CERTIFICATE", `The certificate does not verify: ${verification.message}`);
      const stored = await db.transaction(async (trx) => {
        const r = await insertReduction(trx, {
          projectId: project.id,
          sourceRevisionId: source.revisionId,
          targetRevisionId,
          notion: body.certificate.notion,
          timeScale: body.certificate.time,
          certificate: body.certificate,
          targetKey: statementKey(body.certificate, targetRevisionId),
          flags: [],
          foundBy: user.id,
          foundInRunId: null,
        });
        if (r.isNew) {
          await setVerification(trx, r.id, verification);
          await recordAudit(trx, {
            projectId: project.id,
            actorId: user.id,
            action: "reduction.upload",
            target: r.id,
            details: { notion: body.certificate.notion },
          });
        }
        return r;
      });
      res.status(stored.isNew ? 201 : 200).json({ data: await findReduction(db, project.id, stored.id) });
    },
  );

  async function load(projectId: string, reductionId: string) {
    const r = await findReduction(db, projectId, reductionId);
    if (!r) throw new HttpError(404, "NOT_FOUND", "No such reduction in this project");
    return r;
  }

  router.get(
    "/:reductionId",
    projectAccess(db, "project:read"),
    validate({ params: ReductionParams }),
    async (req, res) => {
      res.json({ data: await load(currentProject(req).id, String(req.params.reductionId)) });
    },
  );

  router.get(
    "/:reductionId/certificate",
    projectAccess(db, "project:read"),
    validate({ params: ReductionParams }),
    async (req, res) => {
      const r = await load(currentProject(req).id, String(req.params.reductionId));
      res.setHeader("Content-Disposition", `attachment; filename="reduction-${r.id}.json"`);
      res.type("application/json").send(JSON.stringify(r.certificate, null, 2));
    },
  );

  router.post(
    "/:reductionId/decision",
    projectAccess(db, "review:decide"),
    validate({ params: ReductionParams, body: DecisionBody }),
    async (req, res) => {
      const body = req.body as z.infer<typeof DecisionBody>;
      const project = currentProject(req);
      const user = currentUser(req);
      const r = await load(project.id, String(req.params.reductionId));
      const state = body.decision === "approve" ? "approved" : "rejected";
      if (state === "approved") {
        // Approval puts the reduction into the model hierarchy, so it must still verify at this moment.
        const verification = checkCertificate(r.certificate, { id: user.id, displayName: user.displayName });
        if (!verification.isValid)
          throw new HttpError(
            409,
            "INVALID_CERTIFICATE",
            `It cannot be approved: the certificate does not verify (${verification.message})`,
          );
      }
      await db.transaction(async (trx) => {
        await setReviewState(trx, r.id, state, user.id);
        await insertEvent(trx, { reductionId: r.id, actorId: user.id, kind: body.decision, comment: body.comment });
        await recordAudit(trx, {
          projectId: project.id,
          actorId: user.id,
          action: `reduction.${body.decision}`,
          target: r.id,
          details: body.comment ? { comment: body.comment } : {},
        });
      });
      res.json({ data: await load(project.id, r.id) });
    },
  );

  router.post(
    "/:reductionId/verify",
    projectAccess(db, "review:decide"),
    validate({ params: ReductionParams }),
    async (req, res) => {
      const project = currentProject(req);
      const user = currentUser(req);
      const r = await load(project.id, String(req.params.reductionId));
      const verification = checkCertificate(r.certificate, { id: user.id, displayName: user.displayName });
      await db.transaction(async (trx) => {
        await setVerification(trx, r.id, verification);
        await insertEvent(trx, {
          reductionId: r.id,
          actorId: user.id,
          kind: "verify",
          comment: "",
          outcome: { isValid: verification.isValid, message: verification.message },
        });
        await recordAudit(trx, {
          projectId: project.id,
          actorId: user.id,
          action: "reduction.verify",
          target: r.id,
          details: { isValid: verification.isValid },
        });
      });
      res.json({ data: await load(project.id, r.id) });
    },
  );

  router.post(
    "/:reductionId/comments",
    projectAccess(db, "comment:write"),
    validate({ params: ReductionParams, body: CommentBody }),
    async (req, res) => {
      const body = req.body as z.infer<typeof CommentBody>;
      const project = currentProject(req);
      const user = currentUser(req);
      const r = await load(project.id, String(req.params.reductionId));
      if (body.parentId && !(await commentBelongsTo(db, body.parentId, r.id))) {
        throw new HttpError(400, "INVALID_INPUT", "body.parentId: no such comment on this reduction", [
          { field: "body.parentId", message: "no such comment on this reduction" },
        ]);
      }
      await db.transaction(async (trx) => {
        const id = await insertComment(trx, {
          reductionId: r.id,
          parentId: body.parentId ?? null,
          authorId: user.id,
          body: body.body,
        });
        await recordAudit(trx, {
          projectId: project.id,
          actorId: user.id,
          action: "reduction.comment",
          target: r.id,
          details: { commentId: id },
        });
      });
      res.status(201).json({ data: await load(project.id, r.id) });
    },
  );

  // A discovered target becomes a model of the project (revision 1 is the certificate's target network), and the
  // reduction now points at it, so that once approved it joins the model hierarchy.
  router.post(
    "/:reductionId/save-target",
    projectAccess(db, "model:write"),
    validate({ params: ReductionParams, body: SaveTargetBody }),
    async (req, res) => {
      const body = req.body as z.infer<typeof SaveTargetBody>;
      const project = currentProject(req);
      const user = currentUser(req);
      const r = await load(project.id, String(req.params.reductionId));
      if (r.target)
        throw new HttpError(409, "ALREADY_SAVED", `The target is already the model "${r.target.modelName}"`);
      const network = networkFromCertificate(r.certificate.target);
      const definition = networkToDefinition(network);
      await db.transaction(async (trx) => {
        const modelId = await insertModel(trx, {
          projectId: project.id,
          name: body.name,
          description: `Target of a ${r.notion} found in ${r.source.modelName} (revision ${r.source.revision}).`,
          createdBy: user.id,
        });
        const revisionId = await insertRevision(trx, {
          modelId,
          revision: 1,
          definition,
          ruleText: printRuleText(definition),
          network: networkSummary(definition, network),
          source: "rules",
          message: `Saved from reduction ${r.id}`,
          createdBy: user.id,
        });
        await setTargetRevision(trx, r.id, revisionId);
        await recordAudit(trx, {
          projectId: project.id,
          actorId: user.id,
          action: "reduction.save-target",
          target: r.id,
          details: { modelId, name: body.name },
        });
      });
      res.status(201).json({ data: await load(project.id, r.id) });
    },
  );

  return router;
}
