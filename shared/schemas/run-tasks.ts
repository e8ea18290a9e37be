// What each run kind's worker tasks receive and hand back (server/workers/tasks): the input a shard was planned with,
// the partial result it returns or checkpoints, and the cursor it resumes from. Shards cross the database as JSON, so
// the worker parses every input and stored partial with these schemas before the engine sees it.
//
// Where a partial is the engine's own result (a search's units, the automaton hierarchy's units), the engine's type
// is the contract: the schema checks its outline and leaves the fields to the engine functions that read them, so the
// engine's shapes are not written twice.
import { z } from "zod";
import type { HierarchyPart } from "../engine/block-emulation";
import type { CertificateNetwork } from "../engine/certificates";
import type {
  BlockEmulationWitness,
  DiscoverShardResult,
  EmulationSearchResult,
  TargetFlag,
} from "../engine/emulation";
import type { ExpectationResult } from "../engine/expectations";
import type { ScreenShard } from "../engine/screens";
import { NodeEliminationParams } from "./elimination";
import { Certificate, ClosureCounterexample, CoarsestGrouping, ReductionSearchParams } from "./reductions";

/** A task's resume point: the position in its shard's units (or items) where the next attempt continues. */
export const ShardCursor = z.number().int().min(0);

/** An engine result kept as JSON: an object with the named fields, typed by the engine. */
function engineResult<T>(what: string, fields: readonly string[]) {
  return z.custom<T>(
    (v) => typeof v === "object" && v !== null && fields.every((f) => f in v),
    `must be ${what} (an object with ${fields.join(", ")})`,
  );
}

/** The schemas of one task: what a shard is planned as, and what it returns. */
export interface ShardTaskSchemas<I extends z.ZodType = z.ZodType, P extends z.ZodType = z.ZodType> {
  input: I;
  partial: P;
}

// --- sleep-count: a deterministic demonstration kind for tests and the run benchmark ---

export const SleepCountShard = z.object({
  from: z.number().int().min(0),
  to: z.number().int().min(0),
  delayMsPerItem: z.number().min(0),
});
export type SleepCountShard = z.infer<typeof SleepCountShard>;
export const SleepCountPartial = z.object({ itemCount: z.number(), sum: z.number(), oddCount: z.number() });
export type SleepCountPartial = z.infer<typeof SleepCountPartial>;
export const sleepCountTask = { input: SleepCountShard, partial: SleepCountPartial } satisfies ShardTaskSchemas;

// --- attractors: exact synchronous attractors of one network, in one shard ---

export const AttractorsShard = z.object({ ruleText: z.string().min(1) });
export type AttractorsShard = z.infer<typeof AttractorsShard>;
/** Also the run's result, which the models API serves as the revision's attractors once the run has succeeded. */
export const AttractorsResult = z.object({
  nodeNames: z.array(z.string()),
  stateCount: z.number().int(),
  maxTransient: z.number().int(),
  meanTransient: z.number(),
  attractors: z.array(z.object({ length: z.number().int(), basin: z.number().int(), states: z.array(z.string()) })),
});
export type AttractorsResult = z.infer<typeof AttractorsResult>;
export const attractorsTask = { input: AttractorsShard, partial: AttractorsResult } satisfies ShardTaskSchemas;

// --- eca-hierarchy: a share of the automaton hierarchy's search units ---

export const EcaHierarchyShard = z.object({
  maxBlock: z.number().int().min(1),
  shardIndex: z.number().int().min(0),
  shardCount: z.number().int().min(1),
});
export type EcaHierarchyShard = z.infer<typeof EcaHierarchyShard>;
export const EcaHierarchyPartial = z.object({
  part: engineResult<HierarchyPart>("a hierarchy part", ["maxBlock", "units"]),
  /** Compute time of the shard so far, summed over its attempts. */
  computeMs: z.number(),
});
export type EcaHierarchyPartial = z.infer<typeof EcaHierarchyPartial>;
export const ecaHierarchyTask = { input: EcaHierarchyShard, partial: EcaHierarchyPartial } satisfies ShardTaskSchemas;

// --- reduction-search: one shard of a given-target, discover or coarse-graining search ---

export const SearchShard = z.object({
  /** A range of the engine's search units, or null for the notions that do not split. */
  range: z.object({ start: z.number().int().min(0), end: z.number().int().min(0) }).nullable(),
});
export type SearchShard = z.infer<typeof SearchShard>;
export const ReductionSearchShard = z.object({ params: ReductionSearchParams, shard: SearchShard });
export type ReductionSearchShard = z.infer<typeof ReductionSearchShard>;

/** A discovered target as a shard stores it: the network in certificate form, so that it survives JSON. */
export interface DiscoverPartialTarget {
  key: string;
  target: CertificateNetwork;
  witness: BlockEmulationWitness;
  times: number[];
  encodings: number;
  flags: TargetFlag[];
  trivial: boolean;
  interactions: number;
  firstUnit: number;
}
type DiscoverPartialShard = Omit<DiscoverShardResult, "targets"> & { targets: DiscoverPartialTarget[] };

export const ReductionSearchPartial = z.discriminatedUnion("mode", [
  z.object({
    mode: z.literal("given-target"),
    emulation: engineResult<EmulationSearchResult>("a block-emulation search result", ["found", "witness", "range"]),
  }),
  z.object({ mode: z.literal("embedding"), time: z.number().int(), map: z.array(z.number().int()).nullable() }),
  z.object({
    mode: z.literal("discover"),
    shard: engineResult<DiscoverPartialShard>("a discover shard result", ["range", "targets"]),
  }),
  z.object({
    mode: z.literal("coarse-grain"),
    certificate: Certificate.nullable(),
    groups: z.number().int().nullable(),
    closes: z.boolean(),
    coarsest: CoarsestGrouping.nullable().default(null),
    method: z.enum(["states", "sat"]).default("states"),
    counterexample: ClosureCounterexample.nullable().default(null),
    coneNodes: z.number().int().nullable().default(null),
  }),
]);
export type ReductionSearchPartial = z.infer<typeof ReductionSearchPartial>;
export const reductionSearchTask = {
  input: ReductionSearchShard,
  partial: ReductionSearchPartial,
} satisfies ShardTaskSchemas;

// --- sat-cycles, trap-spaces, async-attractors: analyses of models beyond exact state-space analysis, one shard ---

const bitText = z.string().regex(/^[01]*$/);
const subspaceText = z.string().regex(/^[01-]*$/);

export const SatCyclesShard = z.object({
  ruleText: z.string().min(1),
  maxLength: z.number().int().min(1),
  maxSolutions: z.number().int().min(1),
});
export type SatCyclesShard = z.infer<typeof SatCyclesShard>;
/** Also the run's result. */
export const SatCyclesResult = z.object({
  nodes: z.array(z.string()),
  maxLength: z.number().int(),
  /** Sorted by length, then by first state; length 1 are the fixed points. */
  cycles: z.array(z.object({ length: z.number().int(), states: z.array(bitText) })),
  /** True when every cycle of length up to maxLength is listed; false when maxSolutions cut the list. */
  complete: z.boolean(),
});
export type SatCyclesResult = z.infer<typeof SatCyclesResult>;
export const satCyclesTask = { input: SatCyclesShard, partial: SatCyclesResult } satisfies ShardTaskSchemas;

export const TrapSpacesShard = z.object({
  ruleText: z.string().min(1),
  kind: z.enum(["minimal", "maximal"]),
  limit: z.number().int().min(1),
});
export type TrapSpacesShard = z.infer<typeof TrapSpacesShard>;
/** Also the run's result. */
export const TrapSpacesResult = z.object({
  nodes: z.array(z.string()),
  kind: z.enum(["minimal", "maximal"]),
  complete: z.boolean(),
  /** One character per node: '0', '1', or '-' for a free node; sorted. */
  trapSpaces: z.array(z.object({ pattern: subspaceText })),
  percolatedNodes: z.number().int(),
});
export type TrapSpacesResult = z.infer<typeof TrapSpacesResult>;
export const trapSpacesTask = { input: TrapSpacesShard, partial: TrapSpacesResult } satisfies ShardTaskSchemas;

export const AsyncAttractorsShard = z.object({ ruleText: z.string().min(1), trapSpaceLimit: z.number().int().min(1) });
export type AsyncAttractorsShard = z.infer<typeof AsyncAttractorsShard>;
/** Also the run's result: the engine's report (shared/engine/trap-spaces/trap-space-attractors.ts). */
export const AsyncAttractorsResult = z.object({
  nodes: z.array(z.string()),
  method: z.enum(["exact", "exact on the percolated subspace", "minimal trap spaces"]),
  completeness: z.enum(["proved complete", "found so far"]),
  attractors: z.array(
    z.object({
      size: z.number().int(),
      pattern: subspaceText,
      states: z.array(bitText).nullable(),
      trapSpace: z.number().int().nullable(),
    }),
  ),
  minimalTrapSpaces: z.array(
    z.object({
      trapSpace: z.object({ pattern: subspaceText }),
      freeNodes: z.number().int(),
      verdict: z.enum(["fixed point", "one attractor", "several attractors", "at least one attractor"]),
      attractorCount: z.number().int().nullable(),
    }),
  ),
  minimalTrapSpacesComplete: z.boolean(),
  outsideMinimalTrapSpaces: z.enum(["excluded", "found", "not excluded"]),
  percolatedNodes: z.number().int(),
});
export type AsyncAttractorsResult = z.infer<typeof AsyncAttractorsResult>;
export const asyncAttractorsTask = {
  input: AsyncAttractorsShard,
  partial: AsyncAttractorsResult,
} satisfies ShardTaskSchemas;

// --- expectation-check: a share of a model's expectations (whole condition groups) on one revision ---

export const ExpectationCheckShard = z.object({
  ruleText: z.string().min(1),
  /** Positions in the run's item list, and the expectations at them (checked by the engine's evaluator). */
  items: z.array(z.object({ index: z.number().int().min(0), expectation: z.unknown() })),
});
export type ExpectationCheckShard = z.infer<typeof ExpectationCheckShard>;
export const ExpectationCheckPartial = z.object({
  results: z.array(
    z.object({
      index: z.number().int().min(0),
      result: engineResult<ExpectationResult>("an expectation result", ["id", "status", "method", "detail"]),
    }),
  ),
});
export type ExpectationCheckPartial = z.infer<typeof ExpectationCheckPartial>;
export const expectationCheckTask = {
  input: ExpectationCheckShard,
  partial: ExpectationCheckPartial,
} satisfies ShardTaskSchemas;

/** Minimal trap spaces of one network: how many, how many fix the phenotype, and whether the list is complete. */
export const TrapSpaceCount = z.object({
  total: z.number().int(),
  withPhenotype: z.number().int(),
  complete: z.boolean(),
});
export type TrapSpaceCount = z.infer<typeof TrapSpaceCount>;

// --- screen: a contiguous range of a perturbation screen's units ---

export const ScreenTaskShard = z.object({
  ruleText: z.string().min(1),
  nodes: z.array(z.string()).min(1),
  pairs: z.boolean(),
  phenotype: z.record(z.string(), z.union([z.literal(0), z.literal(1)])),
  update: z.enum(["synchronous", "asynchronous"]),
  range: z.object({ start: z.number().int().min(0), end: z.number().int().min(0) }),
});
export type ScreenTaskShard = z.infer<typeof ScreenTaskShard>;
export const ScreenTaskPartial = z.object({
  shard: engineResult<ScreenShard>("a screen shard", ["range", "rows", "baseline"]),
  /** Under asynchronous update: per unit of the range, minimal trap spaces and those with the phenotype. */
  trapSpaces: z.array(TrapSpaceCount).nullable(),
  baselineTrapSpaces: TrapSpaceCount.nullable(),
});
export type ScreenTaskPartial = z.infer<typeof ScreenTaskPartial>;
export const screenTask = { input: ScreenTaskShard, partial: ScreenTaskPartial } satisfies ShardTaskSchemas;

// --- node-elimination: a reduced model by node elimination or percolation of constants, in one shard ---

export const NodeEliminationShard = z.object({ ruleText: z.string().min(1), params: NodeEliminationParams });
export type NodeEliminationShard = z.infer<typeof NodeEliminationShard>;
/** Also the run's result. */
export const NodeEliminationResult = z.object({
  mode: z.enum(["nodes", "all-eligible", "percolate"]),
  nodesBefore: z.number().int(),
  nodesAfter: z.number().int(),
  /** In the order they were removed (node order for percolation). */
  eliminated: z.array(z.string()),
  kept: z.array(z.string()),
  /** Nodes left in, with why: self-regulation, or an elimination that would break the regulator limit. */
  notEliminated: z.array(z.object({ node: z.string(), reason: z.string() })),
  /** Percolation: the value of each fixed node (held ones included); empty for elimination. */
  fixed: z.array(z.object({ node: z.string(), value: z.union([z.literal(0), z.literal(1)]) })),
  held: z.array(z.object({ node: z.string(), value: z.union([z.literal(0), z.literal(1)]) })),
  /** The reduced model; empty when every node was eliminated or fixed. */
  ruleText: z.string(),
  preserves: z.string(),
  /** The re-verifiable statement, or null when the model is beyond the certificate format's size. */
  certificate: Certificate.nullable(),
  /** Why there is no certificate (or no model to save). */
  certificateNote: z.string().nullable(),
});
export type NodeEliminationResult = z.infer<typeof NodeEliminationResult>;
export const nodeEliminationTask = {
  input: NodeEliminationShard,
  partial: NodeEliminationResult,
} satisfies ShardTaskSchemas;
