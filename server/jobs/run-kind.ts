// What the queue needs to know about one kind of run: how to check its parameters, how to split it into shards,
// which worker task computes a shard (and the schemas of what it reads and returns), and how to merge the shards'
// partial results (in shard order).
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { z } from "zod";
import type { ShardTaskSchemas } from "@shared/schemas/run-tasks";
import type { AfterMerge } from "../db/repositories/run-shards";

export interface RunKindDefinition<
  PS extends z.ZodType = z.ZodType,
  IS extends z.ZodType = z.ZodType,
  QS extends z.ZodType = z.ZodType,
> {
  kind: string;
  params: PS;
  /** The worker task: its module (default export made with shardTask) and the schemas of its input and partial. */
  task: ShardTaskSchemas<IS, QS> & { file: string };
  /** Time limit for one run of this kind, in seconds. */
  timeLimitSeconds: number;
  /** Shard inputs; `revision` is the run's model revision when it has one. */
  plan(params: z.output<PS>, revision: { ruleText: string } | null): z.input<IS>[];
  merge(partials: z.output<QS>[], params: z.output<PS>): unknown;
  /** When merging is itself long, a worker task that does it in the pool instead of `merge` (made with mergeTask). */
  mergeTaskFile?: string;
  /** Writes that belong to a successful result (in the transaction that marks the run succeeded). */
  afterMerge?: AfterMerge;
}

/** Declares a kind with its types inferred from its schemas. */
export const defineRunKind = <PS extends z.ZodType, IS extends z.ZodType, QS extends z.ZodType>(
  kind: RunKindDefinition<PS, IS, QS>,
): RunKindDefinition<PS, IS, QS> => kind;

const tasksDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../workers/tasks");
export const taskFile = (name: string) => path.join(tasksDir, `${name}.ts`);
