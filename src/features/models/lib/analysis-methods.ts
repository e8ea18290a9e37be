// Which analysis fits a model of a given size, and what each one proves and does not: the words the model page
// writes beside each method. The limits are the engine's own, so the page never offers what the engine refuses.
import { MAX_ASYNC_NODES } from "@shared/engine/state-graph";
import { MAX_TRAP_SPACE_NODES } from "@shared/engine/trap-spaces";
import { MAX_TABLE_NODES } from "@shared/engine/update";
import { INLINE_ANALYSIS_MAX_NODES } from "@shared/schemas/models";

export const EXACT_SYNCHRONOUS_MAX_NODES = MAX_TABLE_NODES;
export const EXACT_ASYNCHRONOUS_MAX_NODES = MAX_ASYNC_NODES;
export const SAT_MAX_NODES = MAX_TRAP_SPACE_NODES;

export type AnalysisMethod = "exact-synchronous" | "sat-cycles" | "trap-spaces" | "async-attractors";

export interface MethodText {
  title: string;
  limit: string;
  proves: string;
  doesNotProve: string;
}

export const METHOD_TEXT: Record<AnalysisMethod, MethodText> = {
  "exact-synchronous": {
    title: "Exact synchronous analysis",
    limit: `Walks all 2^n states: up to ${EXACT_SYNCHRONOUS_MAX_NODES} nodes (up to ${INLINE_ANALYSIS_MAX_NODES} answered at once, larger as a background run).`,
    proves: "Every synchronous attractor with its basin size: the list is complete.",
    doesNotProve: "Anything about asynchronous update beyond the fixed points, which are the same under every update.",
  },
  "sat-cycles": {
    title: "Fixed points and cycles by SAT",
    limit: `No state enumeration: hundreds of nodes for fixed points; cycles get harder with their length (up to 8 steps here).`,
    proves:
      "Every listed state is a fixed point and every listed cycle a synchronous attractor. When the list is marked complete, no other fixed point or synchronous cycle of that length or shorter exists.",
    doesNotProve: "Longer cycles, basin sizes, or cyclic attractors under asynchronous update.",
  },
  "trap-spaces": {
    title: "Trap spaces by SAT",
    limit: `Subspaces (some nodes fixed, the others free) that asynchronous update never leaves; up to ${SAT_MAX_NODES.toLocaleString()} nodes.`,
    proves:
      "Each listed trap space is never left and holds at least one attractor; a minimal trap space that fixes every node is a fixed point, and one with free nodes holds no fixed point.",
    doesNotProve:
      "How many attractors a trap space with free nodes holds, or that no attractor lies outside every minimal trap space.",
  },
  "async-attractors": {
    title: "Asynchronous attractors",
    limit: `Exact up to ${EXACT_ASYNCHRONOUS_MAX_NODES} nodes (or ${EXACT_ASYNCHRONOUS_MAX_NODES} free nodes after percolating constants); beyond, located through minimal trap spaces, analysing exactly those with at most ${EXACT_ASYNCHRONOUS_MAX_NODES} free nodes.`,
    proves:
      "Every listed attractor is an attractor of the general asynchronous update. “Proved complete” means there are no others.",
    doesNotProve:
      "When marked “found so far”: that the list is complete. Undecided trap spaces and attractors outside minimal trap spaces may hold more.",
  },
};

export interface NextStep {
  /** The methods to run first, strongest first. */
  methods: AnalysisMethod[];
  /** One sentence saying why, for this size. */
  reason: string;
}

/** The strongest analyses that fit a model of `nodeCount` nodes. */
export function nextStepFor(nodeCount: number): NextStep {
  if (nodeCount <= EXACT_ASYNCHRONOUS_MAX_NODES)
    return {
      methods: ["exact-synchronous", "async-attractors"],
      reason: `With ${nodeCount} nodes the whole state space can be walked: the synchronous and asynchronous attractors are computed exactly.`,
    };
  if (nodeCount <= EXACT_SYNCHRONOUS_MAX_NODES)
    return {
      methods: ["exact-synchronous", "trap-spaces"],
      reason: `With ${nodeCount} nodes the synchronous state space can still be walked exactly; asynchronous attractors go through minimal trap spaces (exact asynchronous analysis stops at ${EXACT_ASYNCHRONOUS_MAX_NODES} nodes).`,
    };
  return {
    methods: ["sat-cycles", "trap-spaces"],
    reason: `With ${nodeCount} nodes (2^${nodeCount} states) no state space can be walked; SAT finds fixed points, short cycles and trap spaces without enumerating states.`,
  };
}
