// The interactive pool: a few threads, apart from the run system's, for the request work whose cost grows with the
// input (reading model text and files, trajectories, the structure view, certificate checks, small automaton
// hierarchies). The event loop only hands the input over and waits, so /api/health and every other request keep
// answering. Each call has a time and a memory limit; hitting either answers 422 WORK_LIMIT, not a stalled server.
// Inputs under INLINE_INPUT_CHARS run in place: a thread round trip would cost more than the work.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { Piscina } from "piscina";
import { z } from "zod";
import { HttpError } from "../http/errors";
import type { ApiErrorCode } from "@shared/schemas/api-error";
import { interactiveOps, type InteractiveAnswer, type InteractiveOp, type InteractiveOps } from "./interactive-ops";

/** Below this many characters of input the work is a millisecond or two and runs on the request thread. */
export const INLINE_INPUT_CHARS = 32 * 1024;

const Env = z.object({
  INTERACTIVE_THREADS: z.coerce.number().int().min(1).max(64).default(2),
  /** Wall-clock limit of one call; the thread is stopped when it is reached. */
  INTERACTIVE_TIME_LIMIT_MS: z.coerce.number().int().min(100).max(600_000).default(20_000),
  /** V8 old-generation limit of each interactive thread. */
  INTERACTIVE_MEMORY_MB: z.coerce.number().int().min(64).max(16_384).default(768),
});
/** Read once from the environment; a test may lower a limit for one call. */
export const interactiveLimits = Env.parse(process.env);

const taskFile = path.join(path.dirname(fileURLToPath(import.meta.url)), "tasks", "interactive.ts");
let pool: Piscina | null = null;

function thePool(): Piscina {
  pool ??= new Piscina({
    filename: taskFile,
    minThreads: 1,
    maxThreads: interactiveLimits.INTERACTIVE_THREADS,
    execArgv: ["--import", "tsx"],
    resourceLimits: { maxOldGenerationSizeMb: interactiveLimits.INTERACTIVE_MEMORY_MB },
    // Idle threads are unreferenced by piscina, so a CLI command that used the pool still exits.
    idleTimeout: 60_000,
  });
  return pool;
}

function limitHit(what: string): HttpError {
  return new HttpError(422, "WORK_LIMIT", what, {
    timeLimitMs: interactiveLimits.INTERACTIVE_TIME_LIMIT_MS,
    memoryMb: interactiveLimits.INTERACTIVE_MEMORY_MB,
  });
}

/** Runs one operation in the interactive pool under its limits. */
export async function offThread<K extends InteractiveOp>(
  op: K,
  ...args: Parameters<InteractiveOps[K]>
): Promise<ReturnType<InteractiveOps[K]>> {
  let answer: InteractiveAnswer;
  try {
    answer = (await thePool().run(
      { op, args },
      { signal: AbortSignal.timeout(interactiveLimits.INTERACTIVE_TIME_LIMIT_MS) },
    )) as InteractiveAnswer;
  } catch (err) {
    const e = err as { name?: string; code?: string };
    if (e.name === "AbortError" || e.name === "TimeoutError")
      throw limitHit(
        `This request needs more than ${interactiveLimits.INTERACTIVE_TIME_LIMIT_MS / 1000} s of computation; use a smaller input`,
      );
    if (e.code === "ERR_WORKER_OUT_OF_MEMORY")
      throw limitHit(
        `This request needs more than ${interactiveLimits.INTERACTIVE_MEMORY_MB} MB of memory; use a smaller input`,
      );
    throw err;
  }
  if (!answer.ok)
    throw new HttpError(
      answer.error.status,
      answer.error.code as ApiErrorCode,
      answer.error.message,
      answer.error.details,
    );
  return answer.value as ReturnType<InteractiveOps[K]>;
}

/** In place when the caller knows the input is small (e.g. under INLINE_INPUT_CHARS), else in the pool. */
export function inPlaceIfSmall<K extends InteractiveOp>(
  small: boolean,
  op: K,
  ...args: Parameters<InteractiveOps[K]>
): Promise<ReturnType<InteractiveOps[K]>> {
  if (small) {
    const fn = interactiveOps[op] as (...a: unknown[]) => ReturnType<InteractiveOps[K]>;
    return Promise.resolve().then(() => fn(...args));
  }
  return offThread(op, ...args);
}

export async function closeInteractivePool(): Promise<void> {
  const p = pool;
  pool = null;
  await p?.destroy();
}
