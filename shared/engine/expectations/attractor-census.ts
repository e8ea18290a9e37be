// The one shape every attractor method reports in, so outcomes are judged the same way whatever computed them:
// per attractor, each node read as constant 0, constant 1, varying ("~") or unknown to the method ("*"), with flags
// saying whether the list is complete. Exact state-space methods know everything; bounded SAT searches miss long
// cycles; a trap-space method (to be plugged in) knows only the fixed nodes of each minimal trap space.
import type { BooleanNetwork } from "../network";
import type { LongTaskOptions } from "../update";
import type { UpdateKind } from "./expectation";

/** The attractors asked about: all of them, only fixed points, or those reachable from one state (0/1 text). */
export type CensusScope =
  | { readonly kind: "all" }
  | { readonly kind: "fixed-points" }
  | { readonly kind: "reachable-from"; readonly state: string };

/** Why an outcome stays undecided; stable words the product can switch on. */
export type UndecidedReason =
  | "unknown-node"
  | "bad-condition"
  | "cycle-bound"
  | "solution-cap"
  | "trajectory-bound"
  | "needs-trap-spaces"
  | "outside-trap-spaces"
  | "unknown-values"
  | "no-method";

export interface CensusAttractor {
  /** One character per node in node order: "0" or "1" (constant on the attractor), "~" (varies), "*" (unknown). */
  readonly reading: string;
  /** Number of states when the method knows it (1 for a fixed point). */
  readonly size: number | null;
  /** The first states (node-ordered 0/1 text; for a synchronous cycle in dynamics order), at most MAX_LISTED_STATES. */
  readonly states: readonly string[];
}

export interface AttractorCensus {
  /** The method that produced it, reported as the deciding method. */
  readonly method: string;
  /** Distinct entries are distinct attractors (so their number is a lower bound on the attractor count). */
  readonly attractors: readonly CensusAttractor[];
  /** Every attractor in scope is listed. */
  readonly complete: boolean;
  /** Every fixed point in scope is listed (a bounded cycle search is complete for fixed points, not for cycles). */
  readonly fixedPointsComplete: boolean;
  /** When something may be missing: why, for people, and as a stable word. */
  readonly gap: { readonly reason: UndecidedReason; readonly text: string } | null;
}

/** A way to take a census. Extra methods (such as trap spaces) are passed to the evaluator in this shape. */
export interface AttractorMethod {
  readonly name: string;
  accepts(net: BooleanNetwork, update: UpdateKind, scope: CensusScope): boolean;
  census(net: BooleanNetwork, update: UpdateKind, scope: CensusScope, options: LongTaskOptions): AttractorCensus;
}

export const MAX_LISTED_STATES = 16;

/** Read a set of states (0/1 text) node by node: constant value or "~". */
export function readingOfStates(states: readonly string[]): string {
  const first = states[0]!;
  let out = "";
  for (let i = 0; i < first.length; i++) {
    const c = first[i]!;
    out += states.every((s) => s[i] === c) ? c : "~";
  }
  return out;
}

/** Read a set of states given as indices (n <= 32) by AND and OR over their bits. */
export function readingOfIndices(states: ArrayLike<number>, nodeCount: number): string {
  let all = 0xffffffff;
  let any = 0;
  for (let q = 0; q < states.length; q++) {
    all &= states[q]!;
    any |= states[q]!;
  }
  let out = "";
  for (let i = 0; i < nodeCount; i++) out += (all >>> i) & 1 ? "1" : (any >>> i) & 1 ? "~" : "0";
  return out;
}

/** Is the reading that of a fixed point (every node known and constant)? */
export function isFixedPointReading(reading: string): boolean {
  return !/[~*]/.test(reading);
}
