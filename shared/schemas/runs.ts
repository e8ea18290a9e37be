// Runs as the API and the client see them, plus the parameters each run kind accepts.
import { z } from "zod";
import { HierarchyRunParameters } from "./automata";
import { ReductionSearchParams } from "./reductions";
import { ScreenParams } from "./screens";

export const RUN_STATES = ["queued", "running", "succeeded", "failed", "cancelled"] as const;
export const RunState = z.enum(RUN_STATES);
export type RunState = z.infer<typeof RunState>;
const FINISHED_RUN_STATES: readonly RunState[] = ["succeeded", "failed", "cancelled"];
export function isRunFinished(state: RunState): boolean {
  return FINISHED_RUN_STATES.includes(state);
}

export const RUN_KINDS = [
  "sleep-count",
  "eca-hierarchy",
  "attractors",
  "reduction-search",
  "expectation-check",
  "screen",
] as const;

/** Demonstration kind: sums a deterministic function over [0, itemCount) in shards, sleeping per item. */
export const SleepCountParams = z.object({
  itemCount: z.number().int().min(1).max(1_000_000_000),
  shardCount: z.number().int().min(1).max(64).default(4),
  delayMsPerItem: z.number().min(0).max(1000).default(0),
});
export type SleepCountParams = z.infer<typeof SleepCountParams>;
export const SleepCountResult = z.object({ itemCount: z.number(), sum: z.number(), oddCount: z.number() });
export type SleepCountResult = z.infer<typeof SleepCountResult>;

/** Synchronous attractors and basins of the run's model revision, or of a network given as rule text. */
export const AttractorsParams = z.object({ ruleText: z.string().min(1).max(200_000).optional() });
export type AttractorsParams = z.infer<typeof AttractorsParams>;

export const StartRunBody = z.discriminatedUnion("kind", [
  z.object({
    kind: z.literal("sleep-count"),
    modelRevisionId: z.uuid().nullable().default(null),
    params: SleepCountParams,
  }),
  z.object({
    kind: z.literal("attractors"),
    modelRevisionId: z.uuid().nullable().default(null),
    params: AttractorsParams,
  }),
  z.object({
    kind: z.literal("eca-hierarchy"),
    modelRevisionId: z.null().default(null),
    params: HierarchyRunParameters,
  }),
  z.object({ kind: z.literal("reduction-search"), modelRevisionId: z.uuid(), params: ReductionSearchParams }),
  z.object({ kind: z.literal("screen"), modelRevisionId: z.uuid(), params: ScreenParams }),
]);
export type StartRunBody = z.infer<typeof StartRunBody>;

export const RunError = z.object({ code: z.string(), message: z.string() });
export type RunError = z.infer<typeof RunError>;

export const Run = z.object({
  id: z.uuid(),
  projectId: z.uuid(),
  modelRevisionId: z.uuid().nullable(),
  kind: z.string(),
  params: z.unknown(),
  paramsHash: z.string(),
  startedBy: z.uuid().nullable(),
  state: RunState,
  progressFraction: z.number(),
  progressPhase: z.string(),
  shardCount: z.number().int(),
  shardsDone: z.number().int(),
  timeLimitSeconds: z.number().int(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  result: z.unknown().nullable(),
  error: RunError.nullable(),
  attempt: z.number().int(),
});
export type Run = z.infer<typeof Run>;

export const StartRunResponse = Run.extend({ reused: z.boolean() });
export type StartRunResponse = z.infer<typeof StartRunResponse>;

export const RunListQuery = z.object({
  kind: z.string().max(64).optional(),
  state: RunState.optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type RunListQuery = z.infer<typeof RunListQuery>;
export const RunList = z.array(Run);

export const RunParamsPath = z.object({ projectId: z.uuid(), runId: z.uuid() });

export const Notification = z.object({
  id: z.uuid(),
  kind: z.string(),
  title: z.string(),
  body: z.string(),
  link: z.string().nullable(),
  runId: z.uuid().nullable(),
  createdAt: z.string(),
  readAt: z.string().nullable(),
});
export type Notification = z.infer<typeof Notification>;
export const NotificationList = z.object({ items: z.array(Notification), unreadCount: z.number().int() });
export type NotificationList = z.infer<typeof NotificationList>;
export const MarkNotificationsReadBody = z.object({
  ids: z.array(z.uuid()).max(500).optional(),
  all: z.boolean().optional(),
});
export const MarkNotificationsReadResult = z.object({ marked: z.number().int() });
