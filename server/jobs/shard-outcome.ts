// What a worker does once a shard's task has ended, decided from three facts only: why the shard was asked to stop
// (if it was), what the task returned or threw, and how often pg-boss has tried the job. Kept pure so every case
// is tested without threads, queues or a database; run-worker.ts carries the decision out.
import type { RunError } from "@shared/schemas/runs";
import { StopReason, type ShardTaskOutput } from "../workers/task-protocol";

export type ShardOutcome =
  /** The run was cancelled or deleted, or another worker holds the shard now: nothing to write. */
  | { action: "drop" }
  /** This worker is shutting down: keep the latest checkpoint and queue the shard for another worker. */
  | { action: "hand-back" }
  /** The run cannot succeed: finish it as failed with this error. */
  | { action: "fail-run"; error: RunError }
  /** A failure that another attempt may not repeat: give the shard back and let pg-boss retry the job. */
  | { action: "retry"; error: unknown }
  /** The shard is done: store its partial result (and merge if it was the last). */
  | { action: "complete"; partial: unknown };

export interface ShardEnd {
  /** The value of the shard's stop flag when the task ended (StopReason.none when nobody asked it to stop). */
  stopReason: number;
  /** What the task returned, or what running it threw (a crashed or out-of-memory thread). */
  ended: { returned: ShardTaskOutput | undefined } | { threw: unknown };
  /** pg-boss's count of earlier attempts of this job, and how many it allows. */
  retryCount: number;
  retryLimit: number;
  timeLimitSeconds: number;
  workerMemoryMb: number;
}

const OUT_OF_MEMORY = "ERR_WORKER_OUT_OF_MEMORY";

export function shardOutcome(end: ShardEnd): ShardOutcome {
  // A stop request explains whatever the task did after it, so it decides first.
  if (end.stopReason === StopReason.cancelled || end.stopReason === StopReason.leaseLost) return { action: "drop" };
  if (end.stopReason === StopReason.shutdown) return { action: "hand-back" };
  if (end.stopReason === StopReason.timeLimit) {
    return {
      action: "fail-run",
      error: {
        code: "TIME_LIMIT",
        message: `The run exceeded its time limit of ${Math.round(end.timeLimitSeconds / 60)} minutes`,
      },
    };
  }
  if ("threw" in end.ended) {
    const thrown = end.ended.threw;
    if ((thrown as { code?: unknown } | null)?.code === OUT_OF_MEMORY) {
      return {
        action: "fail-run",
        error: { code: "MEMORY_LIMIT", message: `The computation needed more than ${end.workerMemoryMb} MB of memory` },
      };
    }
    if (end.retryCount >= end.retryLimit) {
      return {
        action: "fail-run",
        error: {
          code: "WORKER_ERROR",
          message: `A shard failed ${end.retryCount + 1} times: ${(thrown as Error | null)?.message ?? String(thrown)}`,
        },
      };
    }
    return { action: "retry", error: thrown };
  }
  const output = end.ended.returned;
  if (!output) return { action: "drop" };
  if (!output.ok) {
    // The task saw the stop flag before this worker read it back: the cancellation is already recorded.
    if (output.error.code === "CANCELLED") return { action: "drop" };
    return { action: "fail-run", error: output.error };
  }
  return { action: "complete", partial: output.partial };
}
