// Running a screen whole or as shards: screenRange computes the rows of a contiguous range of units (progress per
// unit, cancellation between and inside units, each row handed to onRow as it is done so a worker can checkpoint),
// mergeScreenShards puts shards that tile the units back together and ranks the rows; runScreen does both at once.
import { CancelledError, EngineError } from "../errors";
import { sameAssignment, type Assignment } from "../expectations";
import type { BooleanNetwork } from "../network";
import type { Progress, ShouldStop } from "../progress";
import { MAX_TABLE_NODES } from "../update";
import { exactScreenContext, exactScreenRow } from "./exact-screen";
import { satScreenContext, satScreenRow } from "./sat-screen";
import { compareRows, type ScreenBaseline, type ScreenMethod, type ScreenRow } from "./screen-row";
import { checkScreenSpec, screenUnit, screenUnitCount, type ScreenSpec } from "./screen-units";

export interface UnitRange {
  readonly start: number;
  readonly end: number;
}

export interface ScreenControl {
  readonly onProgress?: Progress;
  readonly shouldStop?: ShouldStop;
  /** Called with each row as soon as it is computed, in unit order. */
  readonly onRow?: (row: ScreenRow) => void;
  /** Cap on fixed points per SAT enumeration (default 10 000). */
  readonly maxSolutions?: number;
}

export interface ScreenShard {
  readonly range: UnitRange;
  readonly totalUnits: number;
  readonly method: ScreenMethod;
  readonly phenotype: Assignment;
  readonly baseline: ScreenBaseline;
  /** In unit order. */
  readonly rows: ScreenRow[];
}

export interface ScreenResult {
  readonly phenotype: Assignment;
  readonly method: ScreenMethod;
  /** What attractorsBefore/After count: all synchronous attractors (exact) or fixed points (SAT). */
  readonly counted: "attractors" | "fixed-points";
  readonly totalUnits: number;
  readonly baseline: ScreenBaseline;
  /** Ranked by compareRows: basin share descending, then phenotype attractors, then unit order. */
  readonly rows: ScreenRow[];
}

/** The method a screen of this network uses. */
export function screenMethod(net: BooleanNetwork, spec: ScreenSpec): ScreenMethod {
  const limit = Math.min(spec.exactMaxNodes ?? MAX_TABLE_NODES, MAX_TABLE_NODES);
  return net.names.length <= limit ? "exact-synchronous" : "sat-fixed-points";
}

/** Rows of units start..end-1 (each shard analyses the unperturbed model once for its own baseline). */
export function screenRange(
  net: BooleanNetwork,
  spec: ScreenSpec,
  range: UnitRange,
  control: ScreenControl = {},
): ScreenShard {
  checkScreenSpec(net, spec);
  const totalUnits = screenUnitCount(spec);
  if (!(
    Number.isInteger(range.start) &&
    Number.isInteger(range.end) &&
    range.start >= 0 &&
    range.start <= range.end &&
    range.end <= totalUnits
  ))
    throw new EngineError(
      "BAD_SHARD",
      `units ${range.start}..${range.end} are not a range of this screen of ${totalUnits} units`,
    );
  const { onProgress, shouldStop, onRow } = control;
  const method = screenMethod(net, spec);
  const count = range.end - range.start;
  const inner = (done: number) => ({
    shouldStop,
    onProgress: onProgress && ((f: number, phase: string) => onProgress((done + f) / (count + 1), phase)),
  });
  const rows: ScreenRow[] = [];
  let baseline: ScreenBaseline;
  let row: (unit: number, perturbation: Assignment, done: number) => ScreenRow;
  if (method === "exact-synchronous") {
    const ctx = exactScreenContext(net, spec.phenotype, inner(0));
    baseline = ctx.baseline;
    row = (unit, p, done) => exactScreenRow(ctx, unit, p, inner(done));
  } else {
    const ctx = satScreenContext(net, spec.phenotype, control.maxSolutions ?? 10_000, inner(0));
    baseline = ctx.baseline;
    row = (unit, p, done) => satScreenRow(ctx, unit, p, inner(done));
  }
  for (let unit = range.start; unit < range.end; unit++) {
    if (shouldStop?.()) throw new CancelledError();
    const done = unit - range.start + 1;
    onProgress?.(done / (count + 1), "perturbations");
    const r = row(unit, screenUnit(spec, unit).perturbation, done);
    rows.push(r);
    onRow?.(r);
  }
  onProgress?.(1, "perturbations");
  return { range, totalUnits, method, phenotype: spec.phenotype, baseline, rows };
}

/** Merge shards whose ranges tile all units exactly once (in any order); the result equals one unsplit run. */
export function mergeScreenShards(shards: readonly ScreenShard[]): ScreenResult {
  const first = shards[0];
  if (!first) throw new EngineError("BAD_SHARD", "there are no shards to merge");
  const sorted = [...shards].sort((a, b) => a.range.start - b.range.start || a.range.end - b.range.end);
  let next = 0;
  for (const shard of sorted) {
    const samePhenotype = sameAssignment(shard.phenotype, first.phenotype);
    if (shard.totalUnits !== first.totalUnits || shard.method !== first.method || !samePhenotype)
      throw new EngineError("BAD_SHARD", "the shards come from different screens");
    if (shard.range.start !== next)
      throw new EngineError(
        "BAD_SHARD",
        shard.range.start < next
          ? `units from ${shard.range.start} are covered twice`
          : `units ${next}..${shard.range.start - 1} are missing`,
      );
    next = shard.range.end;
  }
  if (next !== first.totalUnits)
    throw new EngineError("BAD_SHARD", `units ${next}..${first.totalUnits - 1} are missing`);
  return {
    phenotype: first.phenotype,
    method: first.method,
    counted: first.method === "exact-synchronous" ? "attractors" : "fixed-points",
    totalUnits: first.totalUnits,
    baseline: first.baseline,
    rows: sorted.flatMap((s) => s.rows).sort(compareRows),
  };
}

/** The whole screen in one call. */
export function runScreen(net: BooleanNetwork, spec: ScreenSpec, control: ScreenControl = {}): ScreenResult {
  return mergeScreenShards([screenRange(net, spec, { start: 0, end: screenUnitCount(spec) }, control)]);
}
