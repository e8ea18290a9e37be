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
import { mentionedMembers, notifyPeople, reductionWords, type NotifyPeopleDeps } from "../notifications/notify-people";
import { checkCertificateOffThread } from "./check-certificate";

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
  /** Without it nobody is told (the bulk action tells each proposer once, for all their reductions). */
  notify?: NotifyPeopleDeps,
): Promise<ReductionDetail> {
  const r = await reductionOf(db, by.projectId, reductionId);
  const state = decision.decision === "approve" ? "approved" : "rejected";
  if (state === "approved") {
    const verification = await checkCertificateOffThread(r.certificate, by.user);
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
  if (notify && r.foundBy && r.foundBy.id !== by.user.id) {
    await notifyPeople(notify, [r.foundBy.id], {
      kind: "reduction.decided",
      title: `Your reduction was ${state}`,
      body: `${by.user.displayName} ${state} ${reductionWords(r)}${decision.comment ? `: "${decision.comment}"` : "."}`,
      link: `/projects/${by.projectId}/reductions/${r.id}`,
    });
  }
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
  notify?: NotifyPeopleDeps,
): Promise<BulkDecisionResult> {
  const decided: string[] = [];
  const skipped: BulkDecisionResult["skipped"] = [];
  const byProposer = new Map<string, number>();
  for (const id of [...new Set(body.reductionIds)]) {
    try {
      const r = await decideReduction(db, by, id, { decision: body.decision, comment: body.comment });
      decided.push(id);
      if (r.foundBy && r.foundBy.id !== by.user.id)
        byProposer.set(r.foundBy.id, (byProposer.get(r.foundBy.id) ?? 0) + 1);
    } catch (err) {
      if (!(err instanceof HttpError)) throw err;
      skipped.push({ id, reason: err.message });
    }
  }
  const state = body.decision === "approve" ? "approved" : "rejected";
  if (notify)
    for (const [proposer, count] of byProposer)
      await notifyPeople(notify, [proposer], {
        kind: "reduction.decided",
        title: count === 1 ? `Your reduction was ${state}` : `${count} of your reductions were ${state}`,
        body: `${by.user.displayName} ${state} ${count === 1 ? "one reduction" : `${count} reductions`} you proposed${body.comment ? `: "${body.comment}"` : "."}`,
        link: `/projects/${by.projectId}/reductions`,
      });
  return { decided, skipped };
}

export async function reverifyReduction(db: Knex, by: ReductionActor, reductionId: string): Promise<ReductionDetail> {
  const r = await reductionOf(db, by.projectId, reductionId);
  const verification = await checkCertificateOffThread(r.certificate, by.user);
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
  notify?: NotifyPeopleDeps,
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
  if (notify) {
    const named = await mentionedMembers(db, by.projectId, comment.body, by.user.id);
    await notifyPeople(notify, named, {
      kind: "comment.mention",
      title: `${by.user.displayName} mentioned you`,
      body: `${by.user.displayName} mentioned you in a comment on ${reductionWords(r)}: "${comment.body.slice(0, 500)}"`,
      link: `/projects/${by.projectId}/reductions/${r.id}`,
    });
  }
  return reductionOf(db, by.projectId, r.id);
}
