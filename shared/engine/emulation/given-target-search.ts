// Given-target search for block emulation: for t = 1..tmax, find the first unit (t, smallest node of block 0)
// whose satisfiability query has a witness; bisection over unit ranges skips unsatisfiable stretches in one query.
// Complete within the stated bounds: "not found" means no witness exists there.
import { CancelledError, EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import type { BlockEmulationWitness } from "./block-witness";
import { EmulationSatInstance } from "./emulation-sat";
import { successorsOfNetwork } from "./network-from-successors";
import { shardRange, type UnitRange } from "./search-units";
import { cycleLengthCounts, cyclesFit } from "./cycle-prefilter";
import { powerTable, successorTable } from "./network-step";
import { enumerateEncodings, enumerationUnitCount, type EnumerationBounds } from "./encoding-enumeration";
import { permutations } from "./canonical-target";

/** Sources up to this size are first checked against G's attractors (F^t is tabulated). */
const PREFILTER_MAX_NODES = 16;

export interface EmulationBounds {
  readonly maxTime: number;
  readonly maxBlock: number;
  /** Source nodes that may belong to blocks (all when omitted). */
  readonly allowedNodes?: readonly number[];
  /** May source nodes stay outside the blocks with a fixed value? (default true) */
  readonly contextAllowed?: boolean;
  /**
   * "sat" (default) asks MiniSat and scales to large sources; "enumeration" walks all encodings of the tabulated
   * state space (sources up to 20 nodes, targets up to 4 nodes).
   */
  readonly method?: "sat" | "enumeration";
}

export interface SearchControl {
  readonly onProgress?: (fraction: number, phase: string) => void;
  readonly shouldStop?: () => boolean;
  /** Work only on this shard (`{ index, count }`) or this unit range. */
  readonly shard?: { readonly index: number; readonly count: number };
  readonly range?: UnitRange;
  /** Resume: units before this one are already known to hold no witness. */
  readonly resumeFrom?: number;
  /** Told after each decided stretch: every unit before `cursor` holds no witness. */
  readonly onCursor?: (cursor: number) => void;
}

export interface EmulationSearchResult {
  readonly found: boolean;
  readonly witness: BlockEmulationWitness | null;
  /** The unit holding the witness. */
  readonly unit: number | null;
  readonly bounds: Required<Omit<EmulationBounds, "allowedNodes" | "method">> & {
    readonly allowedNodes: number[];
    readonly method: "sat" | "enumeration";
  };
  readonly range: UnitRange;
  readonly totalUnits: number;
  readonly satQueries: number;
}

/** Number of units of the search (the sharding and cursor scale): t x first-block start for SAT, t x base state for enumeration. */
export function emulationUnitCount(source: BooleanNetwork, bounds: EmulationBounds): number {
  return (bounds.method ?? "sat") === "sat"
    ? bounds.maxTime * source.names.length
    : enumerationUnitCount(source, bounds.maxTime);
}

/** Search for a block emulation of `target` by `source` within `bounds` (or the shard of it named in `control`). */
export function searchBlockEmulation(
  source: BooleanNetwork,
  target: BooleanNetwork,
  bounds: EmulationBounds,
  control: SearchControl = {},
): EmulationSearchResult {
  const n = source.names.length;
  const m = target.names.length;
  if (m < 1) throw new EngineError("BAD_TARGET", "the target network has no nodes");
  if (m > 12) throw new EngineError("TOO_LARGE", `a target of ${m} nodes is beyond the search (at most 12)`);
  if (!(bounds.maxTime >= 1) || !(bounds.maxBlock >= 1))
    throw new EngineError("BAD_BOUNDS", "time scale and block size bounds must be at least 1");
  const allowed = new Uint8Array(n);
  if (bounds.allowedNodes) {
    for (const v of bounds.allowedNodes) {
      if (!(v >= 0 && v < n)) throw new EngineError("BAD_BOUNDS", `allowed node ${v} is not a source node`);
      allowed[v] = 1;
    }
  } else allowed.fill(1);
  const contextAllowed = bounds.contextAllowed ?? true;
  const targetSucc = successorsOfNetwork(target);
  const method = bounds.method ?? "sat";
  if (method === "enumeration" && m > 4)
    throw new EngineError("BAD_BOUNDS", "the enumeration handles targets of at most 4 nodes");
  const totalUnits = emulationUnitCount(source, bounds);
  const range =
    control.range ??
    (control.shard ? shardRange(totalUnits, control.shard.index, control.shard.count) : { start: 0, end: totalUnits });
  const result = (witness: BlockEmulationWitness | null, unit: number | null): EmulationSearchResult => ({
    found: witness !== null,
    witness,
    unit,
    bounds: {
      maxTime: bounds.maxTime,
      maxBlock: bounds.maxBlock,
      contextAllowed,
      allowedNodes: [...allowed.keys()].filter((v) => allowed[v]),
      method,
    },
    range,
    totalUnits,
    satQueries,
  });
  let satQueries = 0;
  if (method === "enumeration") {
    const hit = enumerationSearch(
      source,
      targetSucc,
      m,
      { ...bounds, maxTargetNodes: m, contextAllowed },
      { ...control, range },
    );
    if (hit) control.onProgress?.(1, "searching block emulations");
    return result(hit?.witness ?? null, hit?.unit ?? null);
  }
  let instance: { t: number; sat: EmulationSatInstance } | null = null;
  const problem = (t: number) => ({
    source,
    targetSucc,
    targetNodes: m,
    time: t,
    maxBlock: bounds.maxBlock,
    allowed,
    contextAllowed,
  });
  // Range queries share one incremental formula per time scale; they only answer yes or no.
  const query = (t: number, lo: number, hi: number) => {
    if (control.shouldStop?.()) throw new CancelledError();
    satQueries++;
    if (instance?.t !== t) instance = { t, sat: new EmulationSatInstance(problem(t)) };
    return instance.sat.solveRange(lo, hi) !== null;
  };
  const span = Math.max(1, range.end - range.start);
  const report = (cursor: number) => {
    control.onCursor?.(cursor);
    control.onProgress?.((cursor - range.start) / span, "searching block emulations");
  };
  // The first satisfiable unit in [lo, hi) of time t, given (when known) that the range is satisfiable.
  const firstUnit = (t: number, lo: number, hi: number, knownSat: boolean): number | null => {
    if (!knownSat && !query(t, lo, hi)) return null;
    if (hi - lo === 1) return lo;
    const mid = (lo + hi) >> 1;
    const left = firstUnit(t, lo, mid, false);
    if (left !== null) return left;
    report((t - 1) * n + mid);
    return firstUnit(t, mid, hi, true);
  };

  // Time scales at which F^t lacks cycles that G's attractors need hold no witness: skip their units.
  const step = n <= PREFILTER_MAX_NODES ? successorTable(source) : null;
  const targetCycles = cycleLengthCounts(targetSucc);
  const attractorsFit = (t: number) => step === null || cyclesFit(cycleLengthCounts(powerTable(step, t)), targetCycles);

  let cursor = Math.max(range.start, control.resumeFrom ?? range.start);
  if (m > n) cursor = range.end;
  while (cursor < range.end) {
    const t = Math.floor(cursor / n) + 1;
    if (!attractorsFit(t)) {
      cursor = Math.min(range.end, t * n);
      report(cursor);
      continue;
    }
    const lo = cursor - (t - 1) * n;
    const hi = Math.min(n, range.end - (t - 1) * n);
    const v = firstUnit(t, lo, hi, false);
    if (v !== null) {
      // The witness of a unit comes from a fresh query on that unit alone, so it does not depend on how the
      // units were split into shards.
      satQueries++;
      const witness = new EmulationSatInstance(problem(t)).solveRange(v, v + 1);
      if (!witness) throw new EngineError("INTERNAL", "a satisfiable unit became unsatisfiable");
      control.onProgress?.(1, "searching block emulations");
      return result(witness, (t - 1) * n + v);
    }
    cursor = t * n > range.end ? range.end : t * n;
    report(cursor);
  }
  return result(null, null);
}

/**
 * The first encoding in unit order whose induced map is G up to renaming and codeword swaps, relabelled to G:
 * the candidate relabellings T of G (node permutation and value flips) are tabulated as maps T G T^-1.
 */
function enumerationSearch(
  source: BooleanNetwork,
  targetSucc: Uint32Array,
  m: number,
  bounds: EnumerationBounds,
  control: SearchControl,
): { witness: BlockEmulationWitness; unit: number } | null {
  const relabellings = new Map<string, { perm: number[]; flip: number }>();
  for (const perm of permutations(m)) {
    for (let flip = 0; flip < 2 ** m; flip++) {
      const T = (x: number) => {
        let y = 0;
        for (let j = 0; j < m; j++) if (((x >>> j) ^ (flip >>> j)) & 1) y |= 1 << perm[j]!;
        return y;
      };
      const h = new Array<number>(2 ** m);
      for (let x = 0; x < h.length; x++) h[T(x)] = T(targetSucc[x]!);
      const key = h.join(",");
      if (!relabellings.has(key)) relabellings.set(key, { perm, flip });
    }
  }
  let hit: { witness: BlockEmulationWitness; unit: number } | null = null;
  enumerateEncodings(
    source,
    bounds,
    control,
    (e) => {
      const r = relabellings.get(e.succ.join(","));
      if (!r) return false;
      const w = e.witness();
      // Target node j is carried by encoding block perm[j]; a flipped node swaps that block's codewords.
      const blocks = Array.from({ length: m }, (_, j) => {
        const b = w.blocks[r.perm[j]!]!;
        return (r.flip >>> j) & 1 ? { nodes: b.nodes, zero: b.one, one: b.zero } : b;
      });
      hit = { witness: { time: w.time, blocks, context: w.context }, unit: e.unit };
      return true;
    },
    m,
  );
  return hit;
}

/** Merge shard results (any order) into what one unsplit run over their union reports. */
export function mergeEmulationShards(results: readonly EmulationSearchResult[]): EmulationSearchResult {
  if (results.length === 0) throw new EngineError("BAD_SHARD", "no shard results to merge");
  const sorted = [...results].sort((a, b) => a.range.start - b.range.start);
  const winner = sorted.find((r) => r.found);
  const first = sorted[0]!;
  const last = sorted[sorted.length - 1]!;
  const satQueries = sorted.reduce((s, r) => s + r.satQueries, 0);
  const range = { start: first.range.start, end: last.range.end };
  return winner ? { ...winner, range, satQueries } : { ...first, range, satQueries };
}
