// What a shard task receives and answers. The thread talks back over a MessagePort (progress, checkpoints) and
// reads a shared flag to know it must stop; it never touches the database (the job handler owns every write).
import type { MessagePort } from "node:worker_threads";

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

export type ShardTaskOutput = { ok: true; partial: unknown } | { ok: false; error: { code: string; message: string } };

export const StopReason = { none: 0, cancelled: 1, timeLimit: 2, leaseLost: 3, shutdown: 4 } as const;
