// Limits and timings of the run queue. Defaults suit production; tests and operators override them through the
// environment (RUN_* variables), read here rather than in server/config.ts because only the queue uses them.
import os from "node:os";
import { z } from "zod";

const Env = z.object({
  /** Seconds without a heartbeat after which a shard's holder is presumed dead and the shard is re-queued. */
  RUN_STALE_SECONDS: z.coerce.number().min(2).max(3600).default(30),
  RUN_HEARTBEAT_MS: z.coerce.number().int().min(100).max(60_000).default(1000),
  RUN_REAP_EVERY_MS: z.coerce.number().int().min(200).max(600_000).default(5000),
  /** Runs of one project that may be running at once; the others wait in the queue. */
  RUN_PROJECT_CONCURRENCY: z.coerce.number().int().min(1).max(1000).default(4),
  /** Unfinished (queued or running) runs one project may have; beyond it a start answers 429 QUEUE_FULL. */
  RUN_QUEUE_CAP: z.coerce.number().int().min(1).max(100_000).default(50),
  /** Runs that took longer than this notify their starter by e-mail and in the app. */
  RUN_NOTIFY_AFTER_SECONDS: z.coerce.number().min(0).default(60),
  /** V8 old-generation limit of each worker thread, so one huge analysis cannot take the machine down. */
  WORKER_MEMORY_MB: z.coerce.number().int().min(64).max(65_536).default(2048),
});

export interface RunSettings {
  staleSeconds: number;
  heartbeatMs: number;
  reapEveryMs: number;
  projectConcurrency: number;
  queueCap: number;
  notifyAfterSeconds: number;
  workerMemoryMb: number;
  threads: number;
}

export function loadRunSettings(env: NodeJS.ProcessEnv = process.env, threads?: number): RunSettings {
  const e = Env.parse(env);
  return {
    staleSeconds: e.RUN_STALE_SECONDS,
    heartbeatMs: e.RUN_HEARTBEAT_MS,
    reapEveryMs: e.RUN_REAP_EVERY_MS,
    projectConcurrency: e.RUN_PROJECT_CONCURRENCY,
    queueCap: e.RUN_QUEUE_CAP,
    notifyAfterSeconds: e.RUN_NOTIFY_AFTER_SECONDS,
    workerMemoryMb: e.WORKER_MEMORY_MB,
    threads: threads ?? os.availableParallelism(),
  };
}
