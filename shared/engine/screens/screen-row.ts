// One row of a screen: what a perturbation does to the attractors and to the share of states that end with the
// phenotype, compared with the unperturbed model.
import type { Assignment } from "../expectations";

/** How rows were computed: exact synchronous basins (up to the exact limit) or fixed points by SAT (above it). */
export type ScreenMethod = "exact-synchronous" | "sat-fixed-points";

export interface ScreenBaseline {
  /** Attractors (exact) or fixed points (SAT) of the unperturbed model. */
  readonly attractors: number;
  /** Of those, the ones with the phenotype. */
  readonly phenotypeAttractors: number;
  /** Share of all states whose attractor has the phenotype; null under SAT (basins need the whole state space). */
  readonly basinShare: number | null;
}

export interface ScreenRow {
  /** Index of the unit in screenUnits order. */
  readonly unit: number;
  /** Node name -> 0 (knocked out) or 1 (over-expressed). */
  readonly perturbation: Assignment;
  /** Share of all 2^n states whose attractor has the phenotype, in [0, 1]; null under SAT. */
  readonly basinShare: number | null;
  /** basinShare minus the baseline's share; null under SAT. */
  readonly basinShareChange: number | null;
  /** Attractors (exact) or fixed points (SAT) before and after the perturbation. */
  readonly attractorsBefore: number;
  readonly attractorsAfter: number;
  readonly phenotypeAttractorsBefore: number;
  readonly phenotypeAttractorsAfter: number;
  /** Attractors of the unperturbed model that are no attractor now (matched by their states), and new ones. */
  readonly attractorsLost: number;
  readonly attractorsGained: number;
  /** Under SAT: the fixed points (0/1 text) with the phenotype, at most MAX_LISTED_FIXED_POINTS; null when exact. */
  readonly phenotypeFixedPoints: readonly string[] | null;
  /** False when the SAT enumeration stopped at its cap (the counts are then lower bounds). */
  readonly complete: boolean;
}

export const MAX_LISTED_FIXED_POINTS = 64;

/** Ranking: basin share descending (null last), then more phenotype attractors, then unit order. */
export function compareRows(a: ScreenRow, b: ScreenRow): number {
  const share = (r: ScreenRow) => (r.basinShare === null ? -1 : r.basinShare);
  return share(b) - share(a) || b.phenotypeAttractorsAfter - a.phenotypeAttractorsAfter || a.unit - b.unit;
}
