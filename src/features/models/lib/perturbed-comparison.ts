// The model under one perturbation beside the unperturbed model: attractors matched by their states into kept,
// lost and gained, each with its basin share and whether it carries the phenotype. Small models get every
// synchronous attractor with exact basins; above BROWSER_EXACT_MAX_NODES (where two full state graphs no longer fit
// a browser tab comfortably) the comparison is of fixed points found by SAT, without basins, and says so.
import { EngineError } from "@shared/engine/errors";
import { resolveAssignment, stateMatches, type Assignment } from "@shared/engine/expectations";
import type { BooleanNetwork } from "@shared/engine/network";
import { compareAttractors, perturbNetwork } from "@shared/engine/perturbation";
import { satFixedPoints } from "@shared/engine/sat";
import { analyseSynchronous, attractorsAsText } from "@shared/engine/state-graph";

/** 2^20 states: two analyses take a few hundred MB at most and a few seconds in a Web Worker. */
export const BROWSER_EXACT_MAX_NODES = 20;
/** Cap on the fixed points one SAT enumeration lists (the counts are then lower bounds). */
export const BROWSER_MAX_FIXED_POINTS = 2000;

export interface ComparedAttractor {
  /** The cycle's states as node-ordered 0/1 text, from the smallest; one state for a fixed point. */
  readonly states: readonly string[];
  /** Share of all states that end on it; null for fixed points found by SAT. */
  readonly share: number | null;
  readonly hasPhenotype: boolean;
}

export interface PerturbedComparison {
  readonly method: "exact-synchronous" | "sat-fixed-points";
  readonly nodes: readonly string[];
  readonly perturbation: Assignment;
  readonly phenotype: Assignment;
  readonly kept: readonly { before: ComparedAttractor; after: ComparedAttractor }[];
  readonly lost: readonly ComparedAttractor[];
  readonly gained: readonly ComparedAttractor[];
  readonly beforeCount: number;
  readonly afterCount: number;
  /** Share of all states whose attractor has the phenotype; null under SAT. */
  readonly phenotypeShareBefore: number | null;
  readonly phenotypeShareAfter: number | null;
  /** False when a SAT enumeration stopped at its cap. */
  readonly complete: boolean;
}

function checkNames(net: BooleanNetwork, assignment: Assignment, what: string): void {
  const { unknown } = resolveAssignment(net, assignment);
  if (unknown.length > 0)
    throw new EngineError(
      "BAD_PERTURBATION",
      `${what}: ${unknown.join(", ")} ${unknown.length === 1 ? "is" : "are"} not in this model`,
    );
}

export function perturbedComparison(
  net: BooleanNetwork,
  perturbation: Assignment,
  phenotype: Assignment,
  exactMaxNodes = BROWSER_EXACT_MAX_NODES,
): PerturbedComparison {
  checkNames(net, perturbation, "perturbation");
  checkNames(net, phenotype, "phenotype");
  if (Object.keys(perturbation).length === 0)
    throw new EngineError("BAD_PERTURBATION", "perturbation: name at least one node");
  const index = new Map(net.names.map((name, i) => [name, i]));
  const entries = Object.entries(perturbation);
  const perturbed = perturbNetwork(net, {
    knockOut: entries.filter(([, v]) => v === 0).map(([name]) => index.get(name)!),
    overExpress: entries.filter(([, v]) => v === 1).map(([name]) => index.get(name)!),
  });
  const pattern = resolveAssignment(net, phenotype).pattern;
  const exact = net.names.length <= exactMaxNodes;
  const read = (network: BooleanNetwork): { attractors: ComparedAttractor[]; complete: boolean } => {
    if (exact) {
      const analysis = analyseSynchronous(network);
      return {
        complete: true,
        attractors: attractorsAsText(analysis).map((a) => ({
          states: a.states,
          share: a.basin / analysis.stateCount,
          hasPhenotype: a.states.every((s) => stateMatches(s, pattern)),
        })),
      };
    }
    const found = satFixedPoints(network, { maxSolutions: BROWSER_MAX_FIXED_POINTS });
    return {
      complete: found.complete,
      attractors: found.states.map((s) => ({ states: [s], share: null, hasPhenotype: stateMatches(s, pattern) })),
    };
  };
  const before = read(net);
  const after = read(perturbed);
  const phenotypeShare = (list: readonly ComparedAttractor[]) =>
    exact ? list.reduce((sum, a) => sum + (a.hasPhenotype ? a.share! : 0), 0) : null;
  const { kept, lost, gained } = compareAttractors(before.attractors, after.attractors);
  return {
    method: exact ? "exact-synchronous" : "sat-fixed-points",
    nodes: net.names,
    perturbation,
    phenotype,
    kept,
    lost,
    gained,
    beforeCount: before.attractors.length,
    afterCount: after.attractors.length,
    phenotypeShareBefore: phenotypeShare(before.attractors),
    phenotypeShareAfter: phenotypeShare(after.attractors),
    complete: before.complete && after.complete,
  };
}
