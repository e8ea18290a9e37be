// Starting, cancelling, retrying and deleting runs: each spans the runs and shards tables, the queue and the audit
// log, so it lives here rather than in the router. Workers notice cancellation and deletion at their next heartbeat.
// Refusals are RunRequestErrors, which the API's error handler answers with their status and code.
import { createHash } from "node:crypto";
import type { Knex } from "knex";
import type { Run, StartRunBody } from "@shared/schemas/runs";
import { recordAudit } from "../db/repositories/audit-log";
import {
  countUnfinishedRuns,
  deleteRun,
  findReusableRun,
  finishRun,
  getRun,
  insertRun,
  resetRunForRetry,
  revisionRuleText,
  tryStartRun,
} from "../db/repositories/runs";
import { runKind } from "./kinds";
import { RunRequestError } from "./run-errors";
import { enqueueRunShards, promoteNextRun, type RunQueue } from "./run-queue";

export interface LifecycleDeps {
  db: Knex;
  queue: RunQueue;
  queueCap: number;
}

/** Key order must not change the hash: objects are written with sorted keys. */
export function paramsHash(params: unknown): string {
  const canonical = (v: unknown): unknown =>
    Array.isArray(v)
      ? v.map(canonical)
      : v && typeof v === "object"
        ? Object.fromEntries(
            Object.keys(v)
              .sort()
              .map((k) => [k, canonical((v as Record<string, unknown>)[k])]),
          )
        : v;
  return createHash("sha256")
    .update(JSON.stringify(canonical(params)))
    .digest("hex");
}

/** Who asks for a lifecycle step; the audit log names them. */
export interface RunActor {
  id: string;
  displayName: string;
}

export interface RunRequest {
  projectId: string;
  /** The starter's user id (null for runs the system starts, as in tests and benchmarks). */
  startedBy: string | null;
  body: StartRunBody;
  /** The audit entry a new run is recorded with (a reused result records nothing). */
  audit?: { action: string; details: Record<string, unknown> };
}

export async function submitRun(deps: LifecycleDeps, req: RunRequest): Promise<{ run: Run; reused: boolean }> {
  const kind = runKind(req.body.kind);
  if (!kind) throw new RunRequestError(400, "UNKNOWN_KIND", `There is no run kind "${req.body.kind}"`);
  const parsed = kind.params.safeParse(req.body.params);
  if (!parsed.success)
    throw new RunRequestError(400, "INVALID_INPUT", `params: ${parsed.error.issues[0]?.message ?? "invalid"}`);
  const params = parsed.data;
  const modelRevisionId = req.body.modelRevisionId ?? null;
  let revision: { ruleText: string } | null = null;
  if (modelRevisionId) {
    const ruleText = await revisionRuleText(deps.db, req.projectId, modelRevisionId);
    if (ruleText === null) throw new RunRequestError(404, "NOT_FOUND", "No such model revision in this project");
    revision = { ruleText };
  }
  const hash = paramsHash(params);
  const stored = await findReusableRun(deps.db, {
    projectId: req.projectId,
    kind: kind.kind,
    modelRevisionId,
    paramsHash: hash,
  });
  if (stored) return { run: stored, reused: true };
  const unfinished = await countUnfinishedRuns(deps.db, req.projectId);
  if (unfinished >= deps.queueCap) {
    throw new RunRequestError(
      429,
      "QUEUE_FULL",
      `This project already has ${unfinished} runs queued or running, the most it may have at once (${deps.queueCap}). ` +
        "Wait for some to finish, or cancel some, then start this run again.",
    );
  }
  const shardInputs = kind.plan(params, revision);
  const { run, shardIds } = await insertRun(deps.db, {
    projectId: req.projectId,
    modelRevisionId,
    kind: kind.kind,
    params,
    paramsHash: hash,
    startedBy: req.startedBy,
    timeLimitSeconds: kind.timeLimitSeconds,
    shardInputs,
  });
  await enqueueShards(deps, run.id, shardIds);
  if (req.audit) {
    const { action, details } = req.audit;
    await recordAudit(deps.db, { projectId: req.projectId, actorId: req.startedBy, action, target: run.id, details });
  }
  return { run, reused: false };
}

/** A failed send is not fatal: the reaper re-sends jobs for queued shards that have none. */
function enqueueShards(deps: LifecycleDeps, runId: string, shardIds: string[]): Promise<void> {
  return enqueueRunShards(deps.db, deps.queue, runId, shardIds);
}

export async function cancelRun(deps: LifecycleDeps, run: Run, by: RunActor): Promise<Run> {
  const cancelled = await finishRun(deps.db, run.id, "cancelled", {
    error: { code: "CANCELLED", message: `Cancelled by ${by.displayName}` },
  });
  if (!cancelled)
    throw new RunRequestError(
      409,
      "RUN_FINISHED",
      `This run has already ${run.state === "succeeded" ? "succeeded" : "ended"}; there is nothing to cancel`,
    );
  await recordRunAudit(deps, run, by, "run.cancel", { kind: run.kind });
  await promoteNextRun(deps.db, deps.queue, run.projectId);
  return (await getRun(deps.db, run.id)) ?? cancelled;
}

export async function retryRun(deps: LifecycleDeps, run: Run, by: RunActor): Promise<Run> {
  const shardIds = await resetRunForRetry(deps.db, run.id);
  if (!shardIds) throw new RunRequestError(409, "RUN_NOT_RETRYABLE", "Only a failed or cancelled run can be retried");
  // Every shard was already done (cancelled just before its merge): a worker's reaper merges a running run.
  if (shardIds.length === 0) await tryStartRun(deps.db, run.id, Number.MAX_SAFE_INTEGER);
  await enqueueShards(deps, run.id, shardIds);
  await recordRunAudit(deps, run, by, "run.retry", { kind: run.kind });
  return (await getRun(deps.db, run.id))!;
}

export async function removeRun(deps: LifecycleDeps, run: Run, by: RunActor): Promise<void> {
  await deleteRun(deps.db, run.id);
  await recordRunAudit(deps, run, by, "run.delete", { kind: run.kind, state: run.state });
}

function recordRunAudit(deps: LifecycleDeps, run: Run, by: RunActor, action: string, details: Record<string, unknown>) {
  return recordAudit(deps.db, { projectId: run.projectId, actorId: by.id, action, target: run.id, details });
}
