// The frame of every worker task: parses what the database handed over with the task's schemas, turns the port and
// stop flag into the engine's onProgress/shouldStop callbacks, and catches engine errors so they cross the thread
// boundary with their code (structured clone drops custom error fields).
import "./yield-to-requests";
import type { z } from "zod";
import { CancelledError, EngineError } from "@shared/engine/errors";
import type { Progress, ShouldStop } from "@shared/engine/progress";
import { ShardCursor, type ShardTaskSchemas } from "@shared/schemas/run-tasks";
import type { RunError } from "@shared/schemas/runs";
import type { MergeTaskInput, MergeTaskOutput, ShardTaskInput, ShardTaskOutput, TaskMessage } from "./task-protocol";

const PROGRESS_EVERY_MS = 100;

export interface TaskContext<P> {
  onProgress: Progress;
  shouldStop: ShouldStop;
  /** Stores a resume point: every unit before `cursor` is done, and `partial` (if any) holds what they gave. */
  checkpoint(fraction: number, phase: string, cursor: number, partial: P | null): void;
}

/** One shard as the task sees it: its planned input and, when resuming, the last checkpoint. */
export interface ShardWork<I, P> {
  input: I;
  cursor: number | null;
  partial: P | null;
}

function taskContext<P>(task: ShardTaskInput): TaskContext<P> {
  let lastSent = 0;
  const post = (m: TaskMessage) => task.port.postMessage(m);
  return {
    onProgress(fraction, phase) {
      const now = Date.now();
      if (now - lastSent < PROGRESS_EVERY_MS && fraction < 1) return;
      lastSent = now;
      post({ type: "progress", fraction, phase });
    },
    shouldStop: () => Atomics.load(task.stopFlag, 0) !== 0,
    checkpoint(fraction, phase, cursor, partial) {
      post({ type: "checkpoint", fraction, phase, cursor, partial });
    },
  };
}

/** Thrown when stored task data does not match its schema: a bug, so the run fails at once instead of retrying. */
class BadTaskData extends Error {
  constructor(what: string, error: z.ZodError) {
    super(
      `the shard's ${what} is not what this task reads (${error.issues[0]?.path.join(".") || "value"}: ${error.issues[0]?.message})`,
    );
  }
}

function parseOrFail<S extends z.ZodType>(schema: S, value: unknown, what: string): z.output<S> {
  const parsed = schema.safeParse(value);
  if (!parsed.success) throw new BadTaskData(what, parsed.error);
  return parsed.data;
}

function knownFailure(err: unknown): RunError | null {
  if (err instanceof CancelledError || err instanceof EngineError) return { code: err.code, message: err.message };
  if (err instanceof BadTaskData) return { code: "BAD_TASK_DATA", message: err.message };
  return null;
}

/**
 * A shard task: `body` gets the parsed shard and the callbacks and returns the shard's partial result. Any other
 * error than an engine error (or a cancellation) is rethrown, so the job is retried and finally fails the run.
 */
export function shardTask<I extends z.ZodType, P extends z.ZodType>(
  schemas: ShardTaskSchemas<I, P>,
  body: (shard: ShardWork<z.output<I>, z.output<P>>, ctx: TaskContext<z.input<P>>) => z.input<P> | Promise<z.input<P>>,
): (task: ShardTaskInput) => Promise<ShardTaskOutput<z.input<P>>> {
  return async (task) => {
    try {
      const shard = {
        input: parseOrFail(schemas.input, task.input, "input"),
        cursor: task.cursor == null ? null : parseOrFail(ShardCursor, task.cursor, "cursor"),
        partial: task.partial == null ? null : parseOrFail(schemas.partial, task.partial, "checkpoint"),
      };
      return { ok: true, partial: await body(shard, taskContext(task)) };
    } catch (err) {
      const failure = knownFailure(err);
      if (failure) return { ok: false, error: failure };
      throw err;
    } finally {
      task.port.close();
    }
  };
}

/** A merge task: the shards' partials and the run's parameters, parsed, in; the run's result out. */
export function mergeTask<PS extends z.ZodType, QS extends z.ZodType, R>(
  schemas: { params: PS; partial: QS },
  body: (partials: z.output<QS>[], params: z.output<PS>) => R,
): (input: MergeTaskInput) => MergeTaskOutput<R> {
  return (input) => {
    try {
      const partials = input.partials.map((p) => parseOrFail(schemas.partial, p, "partial result"));
      return { ok: true, result: body(partials, parseOrFail(schemas.params, input.params, "parameters")) };
    } catch (err) {
      const failure = knownFailure(err);
      if (failure) return { ok: false, error: failure };
      throw err;
    }
  };
}
