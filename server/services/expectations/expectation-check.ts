// Checking a revision against every expectation of its model, as an "expectation-check" run. New revisions start one
// on their own; so do changes to the table (on the latest revision). When a result is stored, a failure where the
// latest earlier checked revision passed the same expectation is flagged as a break and the revision's author told.
import type { Knex } from "knex";
import type { Logger } from "pino";
import type { ExpectationResult } from "@shared/engine/expectations";
import type { ExpectationCheckParams } from "@shared/schemas/expectations";
import { currentResults, insertResults, listExpectations, type NewResult } from "../../db/repositories/expectations";
import { insertNotification } from "../../db/repositories/notifications";
import { RunRequestError } from "../../jobs/run-errors";
import { paramsHash, submitRun, type LifecycleDeps } from "../../jobs/run-lifecycle";

export interface CheckRequest {
  projectId: string;
  modelId: string;
  /** The revision to check (its row id). */
  revisionId: string;
  startedBy: string | null;
}

/** Starts the check run (or answers the stored one for the same table and revision); null when there is nothing to check. */
export async function startExpectationCheck(
  runs: LifecycleDeps,
  req: CheckRequest,
): Promise<{ runId: string; reused: boolean } | null> {
  const stored = await listExpectations(runs.db, req.modelId);
  if (stored.length === 0) return null;
  const params: ExpectationCheckParams = {
    modelId: req.modelId,
    items: stored.map((s) => ({ rowId: s.id, bodyHash: s.bodyHash, expectation: s.expectation })),
  };
  // The run system reuses only finished results; an identical check still going is answered as it is, so two
  // changes in quick succession never leave two equal runs that could not both be stored as succeeded.
  const going = await runs
    .db("runs")
    .where({ kind: "expectation-check", model_revision_id: req.revisionId, params_hash: paramsHash(params) })
    .whereIn("state", ["queued", "running"])
    .first("id");
  if (going) return { runId: going.id as string, reused: true };
  const out = await submitRun(runs, {
    projectId: req.projectId,
    startedBy: req.startedBy,
    body: { kind: "expectation-check", modelRevisionId: req.revisionId, params } as never,
    audit: { action: "run.start", details: { kind: "expectation-check", modelId: req.modelId } },
  });
  return { runId: out.run.id, reused: out.reused };
}

/**
 * The check that follows a change happens in the background: a full queue must not refuse the change itself, so
 * it is logged and the check can be started again from the model page.
 */
export async function checkInBackground(runs: LifecycleDeps, log: Logger | null, req: CheckRequest) {
  try {
    return await startExpectationCheck(runs, req);
  } catch (err) {
    if (err instanceof RunRequestError && err.status === 429) {
      log?.warn({ modelId: req.modelId, revisionId: req.revisionId }, "expectation check not started: queue full");
      return null;
    }
    throw err;
  }
}

/** afterMerge of the check run: store one result per expectation, flag breaks, notify the revision's author. */
export async function storeCheckResults(
  trx: Knex,
  run: { id: string; projectId: string },
  results: ExpectationResult[],
  params: ExpectationCheckParams,
): Promise<void> {
  const revision = (await trx("runs as x")
    .join("model_revisions as r", "r.id", "x.model_revision_id")
    .where("x.id", run.id)
    .first("r.id", "r.revision", "r.created_by", "r.model_id")) as
    { id: string; revision: number; created_by: string | null; model_id: string } | undefined;
  if (!revision) return;
  const earlier = (await currentResults(trx, params.modelId)).filter((c) => c.revision < revision.revision);
  const previous = new Map<string, { revision: number; status: string }>();
  for (const c of earlier) {
    const seen = previous.get(c.expectationId);
    if (!seen || seen.revision < c.revision) previous.set(c.expectationId, { revision: c.revision, status: c.status });
  }
  // Rows deleted while the run was going have nothing to attach a result to.
  const live = new Set(
    (
      await trx("expectations")
        .whereIn(
          "id",
          params.items.map((i) => i.rowId),
        )
        .select("id")
    ).map((r) => r.id as string),
  );
  const rows: NewResult[] = [];
  results.forEach((r, q) => {
    const item = params.items[q]!;
    if (!live.has(item.rowId)) return;
    const before = previous.get(item.rowId);
    rows.push({
      expectationId: item.rowId,
      revisionId: revision.id,
      runId: run.id,
      bodyHash: item.bodyHash,
      status: r.status,
      method: r.method,
      detail: r.detail,
      reason: r.reason,
      broke: r.status === "fail" && before?.status === "pass",
    });
  });
  await insertResults(trx, rows);
  const broken = rows
    .filter((r) => r.broke)
    .map((r) => results[params.items.findIndex((i) => i.rowId === r.expectationId)]!.id);
  if (broken.length > 0 && revision.created_by) {
    await insertNotification(trx, {
      userId: revision.created_by,
      kind: "expectations.broken",
      title: `Revision ${revision.revision} breaks ${broken.length === 1 ? "an expectation" : `${broken.length} expectations`}`,
      body: `Expectations that held on an earlier revision fail on revision ${revision.revision}: ${broken.join(", ")}.`,
      link: `/projects/${run.projectId}/models/${revision.model_id}?revision=${revision.revision}`,
      runId: run.id,
    });
  }
}
