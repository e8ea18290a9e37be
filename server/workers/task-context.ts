// Turns a task's port and stop flag into the engine's onProgress/shouldStop callbacks, and catches engine errors
// so they cross the thread boundary with their code (structured clone drops custom error fields).
import { CancelledError, EngineError } from "@shared/engine/errors";
import type { Progress, ShouldStop } from "@shared/engine/progress";
import type { ShardTaskInput, ShardTaskOutput, TaskMessage } from "./task-protocol";

const PROGRESS_EVERY_MS = 100;

export interface TaskContext {
  onProgress: Progress;
  shouldStop: ShouldStop;
  checkpoint(fraction: number, phase: string, cursor: unknown, partial: unknown): void;
}

export function taskContext(task: ShardTaskInput): TaskContext {
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

export async function runTask(task: ShardTaskInput, body: (ctx: TaskContext) => unknown): Promise<ShardTaskOutput> {
  try {
    const partial = await body(taskContext(task));
    return { ok: true, partial };
  } catch (err) {
    if (err instanceof CancelledError) return { ok: false, error: { code: err.code, message: err.message } };
    if (err instanceof EngineError) return { ok: false, error: { code: err.code, message: err.message } };
    throw err;
  } finally {
    task.port.close();
  }
}
