// Reductions: stored certificates and their review. The certificate schema is the edge check for JSON that comes
// from outside (uploads, the CLI, stored rows); the engine's verifier then re-simulates it.
import { z } from "zod";
import { nodeRecord, PROTOTYPE_KEY_MESSAGE } from "./node-record";

const bits = (what: string) => z.string().regex(/^[01]+$/, `${what} must be a string of 0 and 1`);
// `__proto__` is refused by name: as a key of the context record zod would otherwise drop it without a word (assigning
// it to a plain object sets the prototype instead of adding the key), and no reader accepts it as a node name.
const nodeName = z
  .string()
  .min(1)
  .max(120)
  .refine((name) => name !== "__proto__", PROTOTYPE_KEY_MESSAGE);

const CertificateNode = z
  .object({ name: nodeName, inputs: z.array(nodeName).max(20), table: bits("a truth table") })
  .refine((n) => n.table.length === 2 ** n.inputs.length, {
    message: "a node's table must have 2^inputs rows",
    path: ["table"],
  });
const CertificateNetwork = z.object({ nodes: z.array(CertificateNode).min(1).max(2000) });

const base = {
  format: z.literal("emulant-reduction"),
  version: z.literal(1),
  time: z.number().int().min(1).max(64),
  source: CertificateNetwork,
  target: CertificateNetwork,
};

export const Certificate = z.discriminatedUnion("notion", [
  z.object({
    ...base,
    notion: z.literal("block-emulation"),
    witness: z.object({
      blocks: z
        .array(
          z.object({
            target: nodeName,
            nodes: z.array(nodeName).min(1),
            zero: bits("a codeword"),
            one: bits("a codeword"),
          }),
        )
        .min(1),
      context: nodeRecord(nodeName, z.union([z.literal(0), z.literal(1)])),
    }),
  }),
  z.object({
    ...base,
    notion: z.literal("dynamical-embedding"),
    witness: z.object({ map: z.record(bits("a target state"), bits("a source state")) }),
  }),
  z.object({
    ...base,
    notion: z.literal("coarse-graining"),
    witness: z.object({
      observables: z
        .array(z.object({ target: nodeName, inputs: z.array(nodeName).max(20), table: bits("an observable's table") }))
        .min(1),
      /** Sources above 22 nodes: the source nodes each target node's check reads, and how it is decided. */
      cones: z
        .array(z.object({ target: nodeName, support: z.array(nodeName), method: z.enum(["table", "sat"]) }))
        .optional(),
    }),
  }),
  z.object({
    ...base,
    notion: z.literal("node-elimination"),
    witness: z.object({ eliminated: z.array(nodeName).min(1) }),
  }),
  z.object({
    ...base,
    notion: z.literal("constant-percolation"),
    witness: z.object({
      held: nodeRecord(nodeName, z.union([z.literal(0), z.literal(1)])),
      fixed: nodeRecord(nodeName, z.union([z.literal(0), z.literal(1)])),
    }),
  }),
]);
export type Certificate = z.infer<typeof Certificate>;

export const ReductionNotion = z.enum([
  "block-emulation",
  "dynamical-embedding",
  "coarse-graining",
  "node-elimination",
  "constant-percolation",
]);
export type ReductionNotion = z.infer<typeof ReductionNotion>;
export const ReviewState = z.enum(["proposed", "approved", "rejected"]);
export type ReviewState = z.infer<typeof ReviewState>;

const Person = z.object({ id: z.string(), displayName: z.string() }).nullable();
const ModelRef = z.object({
  modelId: z.string(),
  modelName: z.string(),
  revisionId: z.string(),
  revision: z.number().int(),
});

export const Verification = z.object({
  isValid: z.boolean(),
  message: z.string(),
  checkedAt: z.string(),
  checkedBy: Person,
});
export type Verification = z.infer<typeof Verification>;

export const ReductionSummary = z.object({
  id: z.string(),
  projectId: z.string(),
  notion: ReductionNotion,
  timeScale: z.number().int(),
  source: ModelRef,
  target: ModelRef.nullable(),
  targetNodeCount: z.number().int(),
  targetNames: z.array(z.string()),
  flags: z.array(z.string()),
  /** Position in the ranking of the search that found it (0 = best, and 0 for single results). */
  rank: z.number().int(),
  reviewState: ReviewState,
  foundBy: Person,
  foundInRunId: z.string().nullable(),
  decidedBy: Person,
  decidedAt: z.string().nullable(),
  lastVerification: Verification.nullable(),
  createdAt: z.string(),
});
export type ReductionSummary = z.infer<typeof ReductionSummary>;
export const ReductionList = z.array(ReductionSummary);

export const ReductionEvent = z.object({
  id: z.string(),
  kind: z.enum(["approve", "reject", "verify", "reopen"]),
  actor: Person,
  comment: z.string(),
  outcome: z.record(z.string(), z.unknown()).nullable(),
  createdAt: z.string(),
});
export const ReductionComment = z.object({
  id: z.string(),
  parentId: z.string().nullable(),
  author: Person,
  body: z.string(),
  createdAt: z.string(),
});
export type ReductionComment = z.infer<typeof ReductionComment>;

export const ReductionDetail = ReductionSummary.extend({
  certificate: Certificate,
  events: z.array(ReductionEvent),
  comments: z.array(ReductionComment),
});
export type ReductionDetail = z.infer<typeof ReductionDetail>;
export const SavedReducedModel = z.object({ modelId: z.string(), reduction: ReductionDetail });
export type SavedReducedModel = z.infer<typeof SavedReducedModel>;

export const ReductionParams = z.object({ projectId: z.uuid(), reductionId: z.uuid() });
/** Flags a reviewer may filter by; "none" keeps the unflagged reductions. */
export const ReductionFlagFilter = z.enum(["none", "constant", "identity", "decoupled", "trivial", "isomorphic"]);
export const ReductionSort = z.enum(["newest", "oldest", "smallest", "largest", "rank"]);
export type ReductionSort = z.infer<typeof ReductionSort>;
export const ReductionListQuery = z.object({
  state: ReviewState.optional(),
  notion: ReductionNotion.optional(),
  sourceModelId: z.uuid().optional(),
  flag: ReductionFlagFilter.optional(),
  minTargetNodes: z.coerce.number().int().min(1).max(2000).optional(),
  maxTargetNodes: z.coerce.number().int().min(1).max(2000).optional(),
  runId: z.uuid().optional(),
  sort: ReductionSort.default("newest"),
});

const REJECT_REASON = "say why it is rejected: the person who proposed it reads the reason";
const decisionFields = {
  decision: z.enum(["approve", "reject"]),
  comment: z.string().trim().max(4000).default(""),
};
const reasonGiven = (d: { decision: "approve" | "reject"; comment: string }) =>
  d.decision === "approve" || d.comment.length > 0;
export const DecisionBody = z.object(decisionFields).refine(reasonGiven, { message: REJECT_REASON, path: ["comment"] });
export type DecisionBody = z.input<typeof DecisionBody>;
/** One decision for many reductions at once (the review queue's bulk action). */
export const BulkDecisionBody = z
  .object({ ...decisionFields, reductionIds: z.array(z.uuid()).min(1, "choose at least one reduction").max(200) })
  .refine(reasonGiven, { message: REJECT_REASON, path: ["comment"] });
export type BulkDecisionBody = z.input<typeof BulkDecisionBody>;
export const BulkDecisionResult = z.object({
  decided: z.array(z.string()),
  /** Reductions left as they were, each with why (not found, or a certificate that no longer verifies). */
  skipped: z.array(z.object({ id: z.string(), reason: z.string() })),
});
export type BulkDecisionResult = z.infer<typeof BulkDecisionResult>;
/** Propose one finding that the run kept on its result but did not store (the "propose" button of a finding). */
export const ProposeFindingBody = z.object({ runId: z.uuid(), rank: z.number().int().min(0) });
export const CommentBody = z.object({
  body: z.string().trim().min(1, "a comment cannot be empty").max(4000),
  parentId: z.uuid().optional(),
});
export type CommentBody = z.input<typeof CommentBody>;
export const SaveTargetBody = z.object({ name: z.string().trim().min(1).max(120) });
/** Save a node-elimination run's reduced network as a new model, linked to its source by a proposed reduction. */
export const SaveReducedModelBody = z.object({ runId: z.uuid(), name: z.string().trim().min(1).max(120) });
export type SaveReducedModelBody = z.input<typeof SaveReducedModelBody>;

/** Bounds of a reduction search, validated before a run is queued. */
export const SearchBody = z.discriminatedUnion("mode", [
  z.object({
    mode: z.literal("given-target"),
    notion: z.enum(["block-emulation", "dynamical-embedding"]),
    sourceModelId: z.uuid(),
    targetModelId: z.uuid(),
    maxTime: z.number().int().min(1).max(8).default(3),
    maxBlock: z.number().int().min(1).max(6).default(3),
    allowContext: z.boolean().default(true),
  }),
  z.object({
    mode: z.literal("discover"),
    sourceModelId: z.uuid(),
    maxTargetNodes: z.number().int().min(1).max(4).default(2),
    maxTime: z.number().int().min(1).max(8).default(1),
    maxBlock: z.number().int().min(1).max(4).default(2),
    allowContext: z.boolean().default(true),
  }),
  z.object({
    mode: z.literal("coarse-grain"),
    sourceModelId: z.uuid(),
    observe: z.array(z.string().min(1)).min(1).max(8),
    time: z.number().int().min(1).max(8).default(1),
  }),
]);
export type SearchBody = z.input<typeof SearchBody>;

export const HierarchyGraph = z.object({
  nodes: z.array(
    z.object({ modelId: z.string(), name: z.string(), nodeCount: z.number().int(), revision: z.number().int() }),
  ),
  edges: z.array(
    z.object({
      source: z.string(),
      target: z.string(),
      notion: ReductionNotion,
      timeScale: z.number().int(),
      reductionIds: z.array(z.string()),
      isComposed: z.boolean(),
      isVerified: z.boolean(),
    }),
  ),
});
export type HierarchyGraph = z.infer<typeof HierarchyGraph>;

/** What a reduction-search run carries: the validated search plus the networks it runs on, fixed at submission. */
export const ReductionSearchParams = z.object({
  search: SearchBody,
  sourceRevisionId: z.uuid(),
  targetRevisionId: z.uuid().nullable(),
  sourceRuleText: z.string().min(1),
  targetRuleText: z.string().nullable(),
});
export type ReductionSearchParams = z.infer<typeof ReductionSearchParams>;

/** One proven statement a search returns; the run's merge step stores each as a proposed reduction. */
export const SearchFinding = z.object({
  certificate: Certificate,
  flags: z.array(z.string()),
  rank: z.number().int(),
  /** The stored reduction, once the finding is proposed (by the run itself or later, by a person). */
  reductionId: z.string().nullable().default(null),
});
export type SearchFinding = z.infer<typeof SearchFinding>;

/**
 * A coarse-graining whose observables do not close: the coarsest grouping of source states that does close, as the
 * groups' dynamics (group g goes to succ[g]; label[g] holds the observables' values, bit k = observable k) and as a
 * network on ceil(log2 groups) nodes (group g has the binary code g). Listed only up to a size a person can read.
 */
export const CoarsestGrouping = z.object({
  groups: z.number().int(),
  observe: z.array(z.string()),
  succ: z.array(z.number().int()).nullable(),
  label: z.array(z.number().int()).nullable(),
  ruleText: z.string().nullable(),
});
export type CoarsestGrouping = z.infer<typeof CoarsestGrouping>;

/**
 * A coarse-graining of a large source decided by SAT whose observed nodes do not close: two source states (0/1 text
 * in source node order) equal on the observed nodes, their images after t steps, and the observed nodes on which the
 * images differ. `nodes` names the source nodes, so the view needs nothing else.
 */
export const ClosureCounterexample = z.object({
  nodes: z.array(z.string()),
  observe: z.array(z.string()),
  states: z.tuple([bits("a state"), bits("a state")]),
  images: z.tuple([bits("a state"), bits("a state")]),
  differingNodes: z.array(z.string()).min(1),
});
export type ClosureCounterexample = z.infer<typeof ClosureCounterexample>;

export const ReductionSearchResult = z.object({
  mode: z.enum(["given-target", "discover", "coarse-grain"]),
  found: z.boolean(),
  findings: z.array(SearchFinding),
  /** Discover: how many distinct targets were found in all (only the best are kept as findings). */
  distinctTargets: z.number().int(),
  /** Coarse-graining: size of the coarsest compatible refinement of the observables (unknown when decided by SAT). */
  groups: z.number().int().nullable(),
  coarsest: CoarsestGrouping.nullable().default(null),
  /** Coarse-graining: "states" when every source state was tabulated, "sat" for sources above 22 nodes. */
  method: z.enum(["states", "sat"]).default("states"),
  counterexample: ClosureCounterexample.nullable().default(null),
  /** Coarse-graining by SAT: source nodes that can influence the observed ones within t steps. */
  coneNodes: z.number().int().nullable().default(null),
  bounds: z.record(z.string(), z.unknown()),
  reductionIds: z.array(z.string()).default([]),
  /**
   * Why fewer reductions were stored than targets found: the ranked list on the run holds at most a few hundred
   * findings, flagged ones (constant, identity, decoupled, trivial, isomorphic) wait for a person to propose them,
   * and of the rest only the best few enter review at once.
   */
  heldBack: z
    .object({ notListed: z.number().int(), flagged: z.number().int(), beyondLimit: z.number().int() })
    .default({ notListed: 0, flagged: 0, beyondLimit: 0 }),
});
export type ReductionSearchResult = z.infer<typeof ReductionSearchResult>;
