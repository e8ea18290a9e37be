// Runs as the API and the client see them, plus the parameters each run kind accepts.
import { z } from "zod";
import { HierarchyRunParameters } from "./automata";
import { NodeEliminationParams } from "./elimination";
import { ReductionSearchParams } from "./reductions";
import { ScreenParams } from "./screens";

export { NodeEliminationParams };

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
  "sat-cycles",
  "trap-spaces",
  "async-attractors",
  "expectation-check",
  "screen",
  "node-elimination",
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

/** Fixed points and synchronous cycles of every length up to maxLength by SAT, for models beyond exact analysis. */
export const SatCyclesParams = z.object({
  maxLength: z.number().int().min(1).max(8).default(4),
  maxSolutions: z.number().int().min(1).max(10_000).default(1_000),
});
export type SatCyclesParams = z.infer<typeof SatCyclesParams>;

/** Minimal (or maximal) trap spaces by SAT, up to a number listed. */
export const TrapSpacesParams = z.object({
  kind: z.enum(["minimal", "maximal"]).default("minimal"),
  limit: z.number().int().min(1).max(10_000).default(1_000),
});
export type TrapSpacesParams = z.infer<typeof TrapSpacesParams>;

/** Asynchronous attractors: exact when small enough, else located through minimal trap spaces. */
export const AsyncAttractorsParams = z.object({
  trapSpaceLimit: z.number().int().min(1).max(10_000).default(1_000),
});
export type AsyncAttractorsParams = z.infer<typeof AsyncAttractorsParams>;

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
  z.object({ kind: z.literal("sat-cycles"), modelRevisionId: z.uuid(), params: SatCyclesParams }),
  z.object({ kind: z.literal("trap-spaces"), modelRevisionId: z.uuid(), params: TrapSpacesParams }),
  z.object({ kind: z.literal("async-attractors"), modelRevisionId: z.uuid(), params: AsyncAttractorsParams }),
  z.object({ kind: z.literal("screen"), modelRevisionId: z.uuid(), params: ScreenParams }),
  z.object({ kind: z.literal("node-elimination"), modelRevisionId: z.uuid(), params: NodeEliminationParams }),
]);
export type StartRunBody = z.infer<typeof StartRunBody>;

export const RunError = z.object({ code: z.string(), message: z.string() });
export type RunError = z.infer<typeof RunError>;

/** The model revision a run worked on, named so a person can tell runs apart. */
export const RunModelRef = z.object({ modelId: z.uuid(), modelName: z.string(), revision: z.number().int() });
export type RunModelRef = z.infer<typeof RunModelRef>;

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
  /** A queued run's place in the queue of every project (1 starts next); null once it runs or ends. */
  queuePosition: z.number().int().positive().nullable().default(null),
  /** The run's model revision and, for a given-target search, the target's. */
  model: RunModelRef.nullable().default(null),
  targetModel: RunModelRef.nullable().default(null),
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

/** Which notifications also come by e-mail; every notification arrives in the app. */
export const NotificationPreferences = z.object({
  emailOnDecision: z.boolean(),
  emailOnReviewWaiting: z.boolean(),
  emailOnMention: z.boolean(),
});
export type NotificationPreferences = z.infer<typeof NotificationPreferences>;
export const NOTIFICATION_DEFAULTS: NotificationPreferences = {
  emailOnDecision: true,
  emailOnReviewWaiting: false,
  emailOnMention: true,
};
export const MarkNotificationsReadBody = z.object({
  ids: z.array(z.uuid()).max(500).optional(),
  all: z.boolean().optional(),
});
export const MarkNotificationsReadResult = z.object({ marked: z.number().int() });
