// The review of a stored reduction: approve or reject it, re-run the independent verifier, discuss it in threads.
// Each change is written with its review event and its audit entry in one transaction.
import type { Knex } from "knex";
import type { z } from "zod";
import type {
  BulkDecisionBody,
  BulkDecisionResult,
  CommentBody,
  DecisionBody,
  ReductionDetail,
} from "@shared/schemas/reductions";
import { recordAudit } from "../../db/repositories/audit-log";
import {
  commentBelongsTo,
  findReduction,
  insertComment,
  insertEvent,
  setReviewState,
  setVerification,
} from "../../db/repositories/reductions";
import { HttpError } from "../../http/errors";
import { checkCertificate } from "./check-certificate";

/** Who acts on a project's reductions: the audit log and the verification records name them. */
export interface ReductionActor {
  projectId: string;
  user: { id: string; displayName: string };
}

export async function reductionOf(db: Knex, projectId: string, reductionId: string): Promise<ReductionDetail> {
  const r = await findReduction(db, projectId, reductionId);
  if (!r) throw new HttpError(404, "NOT_FOUND", "No such reduction in this project");
  return r;
}

/** Approval puts the reduction into the model hierarchy, so its certificate must still verify at that moment. */
export async function decideReduction(
  db: Knex,
  by: ReductionActor,
  reductionId: string,
  decision: z.output<typeof DecisionBody>,
): Promise<ReductionDetail> {
  const r = await reductionOf(db, by.projectId, reductionId);
  const state = decision.decision === "approve" ? "approved" : "rejected";
  if (state === "approved") {
    const verification = checkCertificate(r.certificate, by.user);
    if (!verification.isValid)
      throw new HttpError(
        409,
        "INVALID_CERTIFICATE",
        `It cannot be approved: the certificate does not verify (${verification.message})`,
      );
  }
  await db.transaction(async (trx) => {
    await setReviewState(trx, r.id, state, by.user.id);
    await insertEvent(trx, {
      reductionId: r.id,
      actorId: by.user.id,
      kind: decision.decision,
      comment: decision.comment,
    });
    await recordAudit(trx, {
      projectId: by.projectId,
      actorId: by.user.id,
      action: `reduction.${decision.decision}`,
      target: r.id,
      details: decision.comment ? { comment: decision.comment } : {},
    });
  });
  return reductionOf(db, by.projectId, r.id);
}

/**
 * The review queue's bulk action: each reduction is decided on its own (approval re-verifies each certificate), and
 * one that cannot be decided is reported with why instead of failing the others.
 */
export async function decideReductions(
  db: Knex,
  by: ReductionActor,
  body: z.output<typeof BulkDecisionBody>,
): Promise<BulkDecisionResult> {
  const decided: string[] = [];
  const skipped: BulkDecisionResult["skipped"] = [];
  for (const id of [...new Set(body.reductionIds)]) {
    try {
      await decideReduction(db, by, id, { decision: body.decision, comment: body.comment });
      decided.push(id);
    } catch (err) {
      if (!(err instanceof HttpError)) throw err;
      skipped.push({ id, reason: err.message });
    }
  }
  return { decided, skipped };
}

export async function reverifyReduction(db: Knex, by: ReductionActor, reductionId: string): Promise<ReductionDetail> {
  const r = await reductionOf(db, by.projectId, reductionId);
  const verification = checkCertificate(r.certificate, by.user);
  await db.transaction(async (trx) => {
    await setVerification(trx, r.id, verification);
    await insertEvent(trx, {
      reductionId: r.id,
      actorId: by.user.id,
      kind: "verify",
      comment: "",
      outcome: { isValid: verification.isValid, message: verification.message },
    });
    await recordAudit(trx, {
      projectId: by.projectId,
      actorId: by.user.id,
      action: "reduction.verify",
      target: r.id,
      details: { isValid: verification.isValid },
    });
  });
  return reductionOf(db, by.projectId, r.id);
}

export async function commentOnReduction(
  db: Knex,
  by: ReductionActor,
  reductionId: string,
  comment: z.output<typeof CommentBody>,
): Promise<ReductionDetail> {
  const r = await reductionOf(db, by.projectId, reductionId);
  if (comment.parentId && !(await commentBelongsTo(db, comment.parentId, r.id))) {
    throw new HttpError(400, "INVALID_INPUT", "body.parentId: no such comment on this reduction", [
      { field: "body.parentId", message: "no such comment on this reduction" },
    ]);
  }
  await db.transaction(async (trx) => {
    const id = await insertComment(trx, {
      reductionId: r.id,
      parentId: comment.parentId ?? null,
      authorId: by.user.id,
      body: comment.body,
    });
    await recordAudit(trx, {
      projectId: by.projectId,
      actorId: by.user.id,
      action: "reduction.comment",
      target: r.id,
      details: { commentId: id },
    });
  });
  return reductionOf(db, by.projectId, r.id);
}
