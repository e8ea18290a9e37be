// What a shard task receives and answers. The thread talks back over a MessagePort (progress, checkpoints) and
// reads a shared flag to know it must stop; it never touches the database (the job handler owns every write).
// Inputs arrive as the JSON the database holds; each task parses them with its schemas (shared/schemas/run-tasks.ts).
import type { MessagePort } from "node:worker_threads";
import type { RunError } from "@shared/schemas/runs";

export interface ShardTaskInput {
  /** The shard's own description, as planned by the run kind. */
  input: unknown;
  /** Where a previous attempt stopped, with what it had counted so far; null on a fresh start. */
  cursor: unknown;
  partial: unknown;
  port: MessagePort;
  /** Int32Array over a SharedArrayBuffer; non-zero means stop (the value says why, see StopReason). */
  stopFlag: Int32Array;
}

export type TaskMessage =
  | { type: "progress"; fraction: number; phase: string }
  | { type: "checkpoint"; fraction: number; phase: string; cursor: unknown; partial: unknown };

export type ShardTaskOutput<P = unknown> = { ok: true; partial: P } | { ok: false; error: RunError };

/** What a merge task (a kind's mergeTaskFile) receives: the shards' partial results in shard order. */
export interface MergeTaskInput {
  partials: unknown[];
  params: unknown;
}

export type MergeTaskOutput<R = unknown> = { ok: true; result: R } | { ok: false; error: RunError };

export const StopReason = { none: 0, cancelled: 1, timeLimit: 2, leaseLost: 3, shutdown: 4 } as const;
export type StopReason = (typeof StopReason)[keyof typeof StopReason];
