// Screening models above the exact limit by their fixed points, enumerated by SAT (satFixedPoints) for the
// unperturbed model and for each perturbation: basins are out of reach there, so a row tells which fixed points
// carry the phenotype and which fixed points were lost or gained.
import { resolveAssignment, stateMatches, type Assignment, type NodePattern } from "../expectations";
import type { BooleanNetwork } from "../network";
import { perturbNetwork } from "../perturbation";
import { satFixedPoints } from "../sat";
import type { LongTaskOptions } from "../update";
import { MAX_LISTED_FIXED_POINTS, type ScreenBaseline, type ScreenRow } from "./screen-row";

export interface SatScreenContext {
  readonly net: BooleanNetwork;
  readonly phenotype: NodePattern;
  readonly baseFixedPoints: ReadonlySet<string>;
  readonly baseline: ScreenBaseline;
  readonly baseComplete: boolean;
  readonly maxSolutions: number;
}

export function satScreenContext(
  net: BooleanNetwork,
  phenotype: Assignment,
  maxSolutions: number,
  options: LongTaskOptions = {},
): SatScreenContext {
  const pattern = resolveAssignment(net, phenotype).pattern;
  const found = satFixedPoints(net, { ...options, maxSolutions });
  return {
    net,
    phenotype: pattern,
    baseFixedPoints: new Set(found.states),
    baseComplete: found.complete,
    maxSolutions,
    baseline: {
      attractors: found.states.length,
      phenotypeAttractors: found.states.filter((s) => stateMatches(s, pattern)).length,
      basinShare: null,
    },
  };
}

export function satScreenRow(
  ctx: SatScreenContext,
  unit: number,
  perturbation: Assignment,
  options: LongTaskOptions = {},
): ScreenRow {
  const index = new Map(ctx.net.names.map((name, i) => [name, i]));
  const entries = Object.entries(perturbation);
  const perturbed = perturbNetwork(ctx.net, {
    knockOut: entries.filter(([, v]) => v === 0).map(([name]) => index.get(name)!),
    overExpress: entries.filter(([, v]) => v === 1).map(([name]) => index.get(name)!),
  });
  const found = satFixedPoints(perturbed, { ...options, maxSolutions: ctx.maxSolutions });
  const withPhenotype = found.states.filter((s) => stateMatches(s, ctx.phenotype));
  const unchanged = found.states.filter((s) => ctx.baseFixedPoints.has(s)).length;
  return {
    unit,
    perturbation,
    basinShare: null,
    basinShareChange: null,
    attractorsBefore: ctx.baseline.attractors,
    attractorsAfter: found.states.length,
    phenotypeAttractorsBefore: ctx.baseline.phenotypeAttractors,
    phenotypeAttractorsAfter: withPhenotype.length,
    attractorsLost: ctx.baseline.attractors - unchanged,
    attractorsGained: found.states.length - unchanged,
    phenotypeFixedPoints: withPhenotype.slice(0, MAX_LISTED_FIXED_POINTS),
    complete: found.complete && ctx.baseComplete,
  };
}
