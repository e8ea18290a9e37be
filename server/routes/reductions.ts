// /api/projects/:projectId/reductions: stored reductions, their certificates and their review (decisions,
// re-verification, threaded comments). Every change is written with its audit entry in one transaction.
import { Router } from "express";
import type { Knex } from "knex";
import { z } from "zod";
import { networkToCertificate, verifyCertificate } from "../../shared/engine/certificates";
import {
  Certificate,
  CommentBody,
  DecisionBody,
  ReductionListQuery,
  ReductionParams,
  type Verification,
} from "../../shared/schemas/reductions";
import { recordAudit } from "../db/repositories/audit-log";
import {
  commentBelongsTo,
  findReduction,
  insertComment,
  insertEvent,
  insertReduction,
  listReductions,
  setReviewState,
  setVerification,
} from "../db/repositories/reductions";
import { currentProject, currentUser, projectAccess } from "../http/auth";
import { HttpError } from "../http/errors";
import { validate } from "../http/validate";
import { latestRevisionNetwork } from "../reductions/revision-network";
import { statementKey } from "../reductions/statement-key";

const ProjectParams = z.object({ projectId: z.uuid() });
const UploadBody = z.object({ sourceModelId: z.uuid(), targetModelId: z.uuid().optional(), certificate: Certificate });

function verificationOf(certificate: unknown, checkedBy: { id: string; displayName: string } | null): Verification {
  const report = verifyCertificate(certificate);
  return {
    isValid: report.valid,
    message: report.valid ? `valid: ${report.statesChecked} states re-simulated` : report.problems.join("; "),
    checkedAt: new Date().toISOString(),
    checkedBy,
  };
}

export function reductionsRouter(deps: { db: Knex }): Router {
  const { db } = deps;
  const router = Router({ mergeParams: true });

  router.get("/", projectAccess(db, "project:read"), validate({ params: ProjectParams, query: ReductionListQuery }), async (req, res) => {
    const q = req.query as z.infer<typeof ReductionListQuery>;
    res.json({ data: await listReductions(db, currentProject(req).id, q) });
  });

  // A certificate found elsewhere (the command line, another installation) enters review like a search result, but
  // only if it verifies and its source is exactly the model's latest revision.
  router.post("/", projectAccess(db, "run:start"), validate({ params: ProjectParams, body: UploadBody }), async (req, res) => {
    const body = req.body as z.infer<typeof UploadBody>;
    const project = currentProject(req);
    const user = currentUser(req);
    const source = await latestRevisionNetwork(db, project.id, body.sourceModelId, "sourceModelId");
    if (JSON.stringify(networkToCertificate(source.network)) !== JSON.stringify(body.certificate.source)) {
      throw new HttpError(400, "SOURCE_MISMATCH", `certificate.source: it is not the network of "${source.modelName}" revision ${source.revision}`);
    }
    let targetRevisionId: string | null = null;
    if (body.targetModelId) {
      const target = await latestRevisionNetwork(db, project.id, body.targetModelId, "targetModelId");
      if (JSON.stringify(networkToCertificate(target.network)) !== JSON.stringify(body.certificate.target)) {
        throw new HttpError(400, "TARGET_MISMATCH", `certificate.target: it is not the network of "${target.modelName}" revision ${target.revision}`);
      }
      targetRevisionId = target.revisionId;
    }
    const verification = verificationOf(body.certificate, { id: user.id, displayName: user.displayName });
    if (!verification.isValid) throw new HttpError(400, "INVALID_CERTIFICATE", `The certificate does not verify: ${verification.message}`);
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
        await recordAudit(trx, { projectId: project.id, actorId: user.id, action: "reduction.upload", target: r.id, details: { notion: body.certificate.notion } });
      }
      return r;
    });
    res.status(stored.isNew ? 201 : 200).json({ data: await findReduction(db, project.id, stored.id) });
  });

  async function load(projectId: string, reductionId: string) {
    const r = await findReduction(db, projectId, reductionId);
    if (!r) throw new HttpError(404, "NOT_FOUND", "No such reduction in this project");
    return r;
  }

  router.get("/:reductionId", projectAccess(db, "project:read"), validate({ params: ReductionParams }), async (req, res) => {
    res.json({ data: await load(currentProject(req).id, String(req.params.reductionId)) });
  });

  router.get("/:reductionId/certificate", projectAccess(db, "project:read"), validate({ params: ReductionParams }), async (req, res) => {
    const r = await load(currentProject(req).id, String(req.params.reductionId));
    res.setHeader("Content-Disposition", `attachment; filename="reduction-${r.id}.json"`);
    res.type("application/json").send(JSON.stringify(r.certificate, null, 2));
  });

  router.post("/:reductionId/decision", projectAccess(db, "review:decide"), validate({ params: ReductionParams, body: DecisionBody }), async (req, res) => {
    const body = req.body as z.infer<typeof DecisionBody>;
    const project = currentProject(req);
    const user = currentUser(req);
    const r = await load(project.id, String(req.params.reductionId));
    const state = body.decision === "approve" ? "approved" : "rejected";
    if (state === "approved") {
      // Approval puts the reduction into the model hierarchy, so it must still verify at this moment.
      const verification = verificationOf(r.certificate, { id: user.id, displayName: user.displayName });
      if (!verification.isValid) throw new HttpError(409, "INVALID_CERTIFICATE", `It cannot be approved: the certificate does not verify (${verification.message})`);
    }
    await db.transaction(async (trx) => {
      await setReviewState(trx, r.id, state, user.id);
      await insertEvent(trx, { reductionId: r.id, actorId: user.id, kind: body.decision, comment: body.comment });
      await recordAudit(trx, { projectId: project.id, actorId: user.id, action: `reduction.${body.decision}`, target: r.id, details: body.comment ? { comment: body.comment } : {} });
    });
    res.json({ data: await load(project.id, r.id) });
  });

  router.post("/:reductionId/verify", projectAccess(db, "review:decide"), validate({ params: ReductionParams }), async (req, res) => {
    const project = currentProject(req);
    const user = currentUser(req);
    const r = await load(project.id, String(req.params.reductionId));
    const verification = verificationOf(r.certificate, { id: user.id, displayName: user.displayName });
    await db.transaction(async (trx) => {
      await setVerification(trx, r.id, verification);
      await insertEvent(trx, { reductionId: r.id, actorId: user.id, kind: "verify", comment: "", outcome: { isValid: verification.isValid, message: verification.message } });
      await recordAudit(trx, { projectId: project.id, actorId: user.id, action: "reduction.verify", target: r.id, details: { isValid: verification.isValid } });
    });
    res.json({ data: await load(project.id, r.id) });
  });

  router.post("/:reductionId/comments", projectAccess(db, "comment:write"), validate({ params: ReductionParams, body: CommentBody }), async (req, res) => {
    const body = req.body as z.infer<typeof CommentBody>;
    const project = currentProject(req);
    const user = currentUser(req);
    const r = await load(project.id, String(req.params.reductionId));
    if (body.parentId && !(await commentBelongsTo(db, body.parentId, r.id))) {
      throw new HttpError(400, "INVALID_INPUT", "body.parentId: no such comment on this reduction", [{ field: "body.parentId", message: "no such comment on this reduction" }]);
    }
    await db.transaction(async (trx) => {
      const id = await insertComment(trx, { reductionId: r.id, parentId: body.parentId ?? null, authorId: user.id, body: body.body });
      await recordAudit(trx, { projectId: project.id, actorId: user.id, action: "reduction.comment", target: r.id, details: { commentId: id } });
    });
    res.status(201).json({ data: await load(project.id, r.id) });
  });

  return router;
}
