// The worker-thread pool of one process: one thread per core by default, each with a capped V8 heap.
import { Piscina } from "piscina";

export function createWorkerPool(threads: number, maxOldGenerationSizeMb: number): Piscina {
  return new Piscina({
    minThreads: Math.max(1, threads),
    maxThreads: Math.max(1, threads),
    // Tasks are TypeScript: threads load them through tsx whether this process runs under tsx, node or vitest.
    execArgv: ["--import", "tsx"],
    resourceLimits: { maxOldGenerationSizeMb },
    idleTimeout: 30_000,
  });
}
