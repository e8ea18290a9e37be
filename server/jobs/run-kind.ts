// What the queue needs to know about one kind of run: how to check its parameters, how to split it into shards,
// which worker task computes a shard, and how to merge the shards' partial results (in shard order).
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { z } from "zod";
import type { AfterMerge } from "../db/repositories/run-shards";

export interface RunKindDefinition<P = unknown> {
  kind: string;
  params: z.ZodType<P>;
  /** Absolute path of the worker task module (default export taking ShardTaskInput). */
  taskFile: string;
  /** Time limit for one run of this kind, in seconds. */
  timeLimitSeconds: number;
  /** Shard inputs; `revision` is the run's model revision when it has one. */
  plan(params: P, revision: { ruleText: string } | null): unknown[];
  merge(partials: unknown[], params: P): unknown;
  /** When merging is itself long, a worker task that does it in the pool instead of `merge` (input: MergeTaskInput). */
  mergeTaskFile?: string;
  /** Writes that belong to a successful result (in the transaction that marks the run succeeded). */
  afterMerge?: AfterMerge;
}

export interface MergeTaskInput {
  partials: unknown[];
  params: unknown;
}

const tasksDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../workers/tasks");
export const taskFile = (name: string) => path.join(tasksDir, `${name}.ts`);
