// Asynchronous attractors of networks beyond exact state-space analysis, located through minimal trap spaces. Facts
// relied on (Klarner, Bockmayr, Siebert, Natural Computing 2015, section on attractor approximation): a trap space
// is never left, so each holds at least one attractor (a terminal strongly connected component of the general
// asynchronous graph); a minimal trap space with a free node holds no fixed point (a fixed point would be a smaller
// trap space); and every attractor fixes the nodes that percolation fixes (a constant node, once updated, never
// changes again). What only exact analysis can settle is how many attractors a trap space holds, and whether an
// attractor lies outside every minimal trap space ("motif-avoidant"). So: the whole network is analysed exactly when
// it has at most MAX_ASYNC_NODES nodes, else its percolated part when that is small enough, else each minimal trap
// space whose free part is small enough; anything larger is reported as undecided, never as complete.
import { CancelledError } from "../errors";
import type { BooleanNetwork } from "../network";
import type { Progress, ShouldStop } from "../progress";
import { asynchronousAttractors, MAX_ASYNC_NODES } from "../state-graph";
import { FREE, fixedByName, percolate, restrictToSubspace, subspacePattern } from "./subspace";
import { forEachTrapSpace, MAX_TRAP_SPACE_NODES, type TrapSpace } from "./trap-spaces";

/** Largest network accepted (the minimal trap spaces come first). */
export const MAX_ATTRACTOR_REPORT_NODES = MAX_TRAP_SPACE_NODES;
/** Largest free part (in nodes) of a subspace that is analysed exactly (the exact asynchronous limit). */
export const MAX_EXACT_FREE_NODES = MAX_ASYNC_NODES;
/** Attractors with more states than this are reported by size and pattern, without their states. */
export const MAX_LISTED_ATTRACTOR_STATES = 256;
/** Default cap on the number of minimal trap spaces examined. */
export const DEFAULT_ATTRACTOR_TRAP_SPACE_LIMIT = 1_000;

export interface LocatedAttractor {
  /** Number of states (1 for a fixed point). */
  readonly size: number;
  /** '0'/'1' for nodes constant on the attractor, '-' for nodes that change in it. */
  readonly pattern: string;
  /** States as node-ordered 0/1 text, sorted; null when size exceeds MAX_LISTED_ATTRACTOR_STATES. */
  readonly states: string[] | null;
  /** Index in `minimalTrapSpaces` of the minimal trap space holding it, or null when it lies in none. */
  readonly trapSpace: number | null;
}

export type TrapSpaceVerdict =
  /** The trap space fixes every node. */
  | "fixed point"
  /** Exact analysis of its free part found exactly one attractor. */
  | "one attractor"
  /** Exact analysis found more than one (all listed). */
  | "several attractors"
  /** Too many free nodes for exact analysis: it holds at least one attractor, none of them a fixed point. */
  | "at least one attractor";

export interface MinimalTrapSpaceReport {
  readonly trapSpace: TrapSpace;
  readonly freeNodes: number;
  readonly verdict: TrapSpaceVerdict;
  /** Attractors proved to lie in it: all of them unless the verdict is "at least one attractor" (then none). */
  readonly attractorCount: number | null;
}

export type AttractorMethod = "exact" | "exact on the percolated subspace" | "minimal trap spaces";

export interface AsynchronousAttractorReport {
  readonly nodes: string[];
  readonly method: AttractorMethod;
  /**
   * "proved complete": every attractor of the network is listed. "found so far": each listed attractor is proved to
   * be one, but others may exist (in undecided trap spaces, beyond the trap-space limit, or outside every minimal
   * trap space).
   */
  readonly completeness: "proved complete" | "found so far";
  /** Every attractor listed is proved to be an attractor (a terminal component of the asynchronous graph). */
  readonly attractors: LocatedAttractor[];
  readonly minimalTrapSpaces: MinimalTrapSpaceReport[];
  /** False when the trap-space limit cut the list of minimal trap spaces. */
  readonly minimalTrapSpacesComplete: boolean;
  /** Attractors outside every minimal trap space: excluded only by exact analysis. */
  readonly outsideMinimalTrapSpaces: "excluded" | "found" | "not excluded";
  /** Nodes fixed by percolation (every attractor fixes them). */
  readonly percolatedNodes: number;
}

export interface AttractorReportOptions {
  /** Cap on minimal trap spaces examined (default DEFAULT_ATTRACTOR_TRAP_SPACE_LIMIT). */
  readonly trapSpaceLimit?: number;
  /** Largest free part analysed exactly (default and maximum MAX_EXACT_FREE_NODES; lower it to save memory). */
  readonly maxExactNodes?: number;
  readonly onProgress?: Progress;
  readonly shouldStop?: ShouldStop;
}

/** Attractors of the general asynchronous dynamics, as far as they can be proved. */
export function asynchronousAttractorReport(
  net: BooleanNetwork,
  options: AttractorReportOptions = {},
): AsynchronousAttractorReport {
  const n = net.names.length;
  const { onProgress, shouldStop } = options;
  const trapSpaceLimit = options.trapSpaceLimit ?? DEFAULT_ATTRACTOR_TRAP_SPACE_LIMIT;
  const exactLimit = Math.min(options.maxExactNodes ?? MAX_EXACT_FREE_NODES, MAX_EXACT_FREE_NODES);
  onProgress?.(0, "minimal trap spaces");
  const minimal: Int8Array[] = [];
  const search = forEachTrapSpace(
    net,
    {
      kind: "minimal",
      limit: trapSpaceLimit,
      shouldStop,
      onProgress: (f, phase) => onProgress?.(0.3 * f, phase),
    },
    (s) => void minimal.push(s),
  );
  minimal.sort((a, b) => (subspacePattern(a) < subspacePattern(b) ? -1 : 1));
  const percolated = percolate(net);
  const percolatedFree = countFree(percolated);

  // One exact analysis covering every attractor, when some subspace known to hold them all is small enough.
  const whole = n <= exactLimit ? new Int8Array(n).fill(FREE) : percolatedFree <= exactLimit ? percolated : null;
  if (whole) {
    onProgress?.(0.3, "exact asynchronous analysis");
    const attractors = exactAttractors(net, whole, minimal, shouldStop);
    const counts = minimal.map((_, k) => attractors.filter((a) => a.trapSpace === k).length);
    onProgress?.(1, "done");
    return {
      nodes: [...net.names],
      method: n > exactLimit ? "exact on the percolated subspace" : "exact",
      completeness: "proved complete",
      attractors,
      minimalTrapSpaces: minimal.map((s, k) => ({
        ...describe(net, s),
        verdict: countFree(s) === 0 ? "fixed point" : counts[k] === 1 ? "one attractor" : "several attractors",
        attractorCount: counts[k]!,
      })),
      minimalTrapSpacesComplete: search.complete,
      outsideMinimalTrapSpaces: attractors.some((a) => a.trapSpace === null) ? "found" : "excluded",
      percolatedNodes: n - percolatedFree,
    };
  }

  const attractors: LocatedAttractor[] = [];
  const reports: MinimalTrapSpaceReport[] = [];
  minimal.forEach((s, k) => {
    if (shouldStop?.()) throw new CancelledError();
    onProgress?.(0.3 + (0.7 * k) / minimal.length, `trap space ${k + 1} of ${minimal.length}`);
    const free = countFree(s);
    if (free > exactLimit) {
      reports.push({ ...describe(net, s), verdict: "at least one attractor", attractorCount: null });
      return;
    }
    const inside = exactAttractors(net, s, [s], shouldStop).map((a) => ({ ...a, trapSpace: k }));
    attractors.push(...inside);
    reports.push({
      ...describe(net, s),
      verdict: free === 0 ? "fixed point" : inside.length === 1 ? "one attractor" : "several attractors",
      attractorCount: inside.length,
    });
  });
  onProgress?.(1, "done");
  return {
    nodes: [...net.names],
    method: "minimal trap spaces",
    completeness: "found so far",
    attractors,
    minimalTrapSpaces: reports,
    minimalTrapSpacesComplete: search.complete,
    outsideMinimalTrapSpaces: "not excluded",
    percolatedNodes: n - percolatedFree,
  };
}

function countFree(s: Int8Array): number {
  let free = 0;
  for (let i = 0; i < s.length; i++) if (s[i] === FREE) free++;
  return free;
}

function describe(net: BooleanNetwork, s: Int8Array): { trapSpace: TrapSpace; freeNodes: number } {
  return { trapSpace: { fixed: fixedByName(net, s), pattern: subspacePattern(s) }, freeNodes: countFree(s) };
}

/**
 * Exact asynchronous attractors of the network on a subspace that is a trap space (so its terminal components are
 * terminal in the whole graph), each placed in the first of `trapSpaces` that contains it.
 */
function exactAttractors(
  net: BooleanNetwork,
  subspace: Int8Array,
  trapSpaces: readonly Int8Array[],
  shouldStop?: ShouldStop,
): LocatedAttractor[] {
  const { network: free, nodes } = restrictToSubspace(net, subspace);
  const analysis = asynchronousAttractors(free, { shouldStop });
  const base = subspacePattern(subspace);
  return analysis.attractors.map((a) => {
    const lift = (index: number): string => {
      const chars = [...base];
      for (let q = 0; q < nodes.length; q++) chars[nodes[q]!] = (index >>> q) & 1 ? "1" : "0";
      return chars.join("");
    };
    // Nodes that change somewhere in the attractor: OR of (state XOR first state).
    let varying = 0;
    for (const x of a.states) varying |= x ^ a.states[0]!;
    const first = [...lift(a.states[0]!)];
    for (let q = 0; q < nodes.length; q++) if ((varying >>> q) & 1) first[nodes[q]!] = "-";
    const pattern = first.join("");
    const states = a.size <= MAX_LISTED_ATTRACTOR_STATES ? Array.from(a.states, lift).sort() : null;
    const k = trapSpaces.findIndex((t) => contains(t, pattern));
    return { size: a.size, pattern, states, trapSpace: k < 0 ? null : k };
  });
}

/** Does the trap space t contain every state matching the pattern (t's fixed nodes fixed alike in it)? */
function contains(t: Int8Array, pattern: string): boolean {
  for (let i = 0; i < t.length; i++) {
    if (t[i] === FREE) continue;
    if (pattern[i] !== (t[i] === 1 ? "1" : "0")) return false;
  }
  return true;
}
