// Discover mode: find every target of 1..4 nodes that a source emulates within the bounds (an encoding whose encoded
// set is closed under F^t induces a target network), up to renaming and codeword swaps. Sources up to 16 nodes are
// enumerated; larger ones go to MiniSat with G's table bits as variables, excluding each found target's relabellings.
// Block emulation as in Ollinger, "Intrinsic universality and cellular automata", Theoretical Computer Science, 2003.
import { CancelledError, EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import type { BlockEmulationWitness } from "./block-witness";
import { canonicalTargetKey, interactionCount, trivialityFlags, type TargetFlag } from "./canonical-target";
import { networkFromSuccessors } from "./network-from-successors";
import { shardRange, type UnitRange } from "./search-units";
import { EmulationSatInstance } from "./emulation-sat";
import { relabelledTables } from "./canonical-target";
import type { SearchControl } from "./given-target-search";
import { enumerateEncodings, enumerationUnitCount, type EnumerationBounds } from "./encoding-enumeration";

export interface DiscoverBounds extends EnumerationBounds {
  /** "enumeration" (default up to 16 source nodes) or "sat" (default above). */
  readonly method?: "enumeration" | "sat";
}

/** Largest source that discover enumerates by default. */
const DEFAULT_ENUMERATION_MAX_NODES = 16;
/** Targets one SAT unit (a time scale and a target size) reports at most. */
export const MAX_SAT_TARGETS_PER_UNIT = 256;

function discoverMethod(source: BooleanNetwork, bounds: DiscoverBounds): "enumeration" | "sat" {
  return bounds.method ?? (source.names.length <= DEFAULT_ENUMERATION_MAX_NODES ? "enumeration" : "sat");
}

export interface DiscoveredTarget {
  /** Canonical form of the target map; equal keys mean equal targets up to renaming and codeword swaps. */
  readonly key: string;
  readonly target: BooleanNetwork;
  readonly witness: BlockEmulationWitness;
  /** Time scales at which some encoding shows this target. */
  readonly times: number[];
  /** Encodings (base state, blocks, time) showing it; by SAT, the number of units (time, size) that found it. */
  readonly encodings: number;
  readonly flags: TargetFlag[];
  readonly trivial: boolean;
  readonly interactions: number;
  /** Unit where it was first found (fixes the representative witness independently of sharding). */
  readonly firstUnit: number;
}

export interface DiscoverShardResult {
  readonly range: UnitRange;
  readonly totalUnits: number;
  /** Work done: candidate encodings whose images were stepped (pruned candidates are not counted), or SAT queries. */
  readonly encodingsChecked: number;
  readonly targets: DiscoveredTarget[];
}

export interface DiscoverResult {
  /** Ranked: non-trivial first, then more target nodes, more interactions, smaller time scale, smaller blocks. */
  readonly targets: DiscoveredTarget[];
  readonly encodingsChecked: number;
  readonly totalUnits: number;
}

/** Units: (t, base state) by enumeration; (t, target size) by SAT. */
export function discoverUnitCount(source: BooleanNetwork, bounds: DiscoverBounds): number {
  return discoverMethod(source, bounds) === "sat"
    ? bounds.maxTime * bounds.maxTargetNodes
    : enumerationUnitCount(source, bounds.maxTime);
}

/** Run the discover enumeration over one shard (or all units) and return its findings in unit order. */
export function discoverShard(
  source: BooleanNetwork,
  bounds: DiscoverBounds,
  control: SearchControl = {},
): DiscoverShardResult {
  if (discoverMethod(source, bounds) === "sat") return discoverShardBySat(source, bounds, control);
  const found = new Map<
    string,
    { succ: number[]; witness: BlockEmulationWitness; times: number[]; encodings: number; firstUnit: number }
  >();
  // Canonical keys cost m! 2^m relabellings each, while encodings are many and their raw tables few: one key per
  // raw table, looked up by the table packed into two words (4 bits per entry).
  const keyOfTable = new Map<number, Map<number, string>>();
  const run = enumerateEncodings(source, bounds, control, (e) => {
    const m = e.masks.length;
    let low = 0;
    let high = 0;
    for (let x = 0; x < e.succ.length; x++)
      if (x < 8) low += e.succ[x]! * 2 ** (4 * x);
      else high += e.succ[x]! * 2 ** (4 * (x - 8));
    const first = low + m * 2 ** 32;
    let byHigh = keyOfTable.get(first);
    if (!byHigh) keyOfTable.set(first, (byHigh = new Map()));
    let key = byHigh.get(high);
    if (key === undefined) byHigh.set(high, (key = canonicalTargetKey(e.succ, m)));
    const entry = found.get(key);
    if (entry) {
      entry.encodings++;
      if (!entry.times.includes(e.time)) entry.times.push(e.time);
      return;
    }
    found.set(key, { succ: [...e.succ], witness: e.witness(), times: [e.time], encodings: 1, firstUnit: e.unit });
  });
  const targets = [...found.entries()].map(([key, e]) => describe(source, key, e));
  return { range: run.range, totalUnits: run.totalUnits, encodingsChecked: run.encodingsChecked, targets };
}

/** Discover by satisfiability: per unit (t, m), ask for targets one by one, excluding each one's relabellings. */
function discoverShardBySat(
  source: BooleanNetwork,
  bounds: DiscoverBounds,
  control: SearchControl,
): DiscoverShardResult {
  const n = source.names.length;
  const M = bounds.maxTargetNodes;
  if (!(M >= 1 && M <= 4)) throw new EngineError("BAD_BOUNDS", "discover looks for targets of 1 to 4 nodes");
  if (!(bounds.maxTime >= 1) || !(bounds.maxBlock >= 1))
    throw new EngineError("BAD_BOUNDS", "time scale and block size bounds must be at least 1");
  const allowed = new Uint8Array(n);
  for (const v of bounds.allowedNodes ?? [...Array(n).keys()]) {
    if (!(v >= 0 && v < n)) throw new EngineError("BAD_BOUNDS", `allowed node ${v} is not a source node`);
    allowed[v] = 1;
  }
  const totalUnits = bounds.maxTime * M;
  const range =
    control.range ??
    (control.shard ? shardRange(totalUnits, control.shard.index, control.shard.count) : { start: 0, end: totalUnits });
  const found = new Map<
    string,
    { succ: number[]; witness: BlockEmulationWitness; times: number[]; encodings: number; firstUnit: number }
  >();
  let queries = 0;
  const span = Math.max(1, range.end - range.start);
  for (let unit = Math.max(range.start, control.resumeFrom ?? range.start); unit < range.end; unit++) {
    control.onCursor?.(unit);
    control.onProgress?.((unit - range.start) / span, "searching targets");
    const time = Math.floor(unit / M) + 1;
    const m = (unit % M) + 1;
    if (m > n) continue;
    const sat = new EmulationSatInstance({
      source,
      targetSucc: null,
      targetNodes: m,
      time,
      maxBlock: bounds.maxBlock,
      allowed,
      contextAllowed: bounds.contextAllowed ?? true,
    });
    for (let k = 0; k < MAX_SAT_TARGETS_PER_UNIT; k++) {
      if (control.shouldStop?.()) throw new CancelledError();
      queries++;
      const next = sat.nextTarget((succ) => relabelledTables(succ, m));
      if (!next) break;
      const key = canonicalTargetKey(next.succ, m);
      const entry = found.get(key);
      if (entry) {
        entry.encodings++;
        if (!entry.times.includes(time)) entry.times.push(time);
      } else found.set(key, { succ: next.succ, witness: next.witness, times: [time], encodings: 1, firstUnit: unit });
    }
  }
  control.onCursor?.(range.end);
  control.onProgress?.(1, "searching targets");
  const targets = [...found.entries()].map(([key, e]) => describe(source, key, e));
  return { range, totalUnits, encodingsChecked: queries, targets };
}

function describe(
  source: BooleanNetwork,
  key: string,
  e: { succ: number[]; witness: BlockEmulationWitness; times: number[]; encodings: number; firstUnit: number },
): DiscoveredTarget {
  const m = e.witness.blocks.length;
  const used = new Set<string>();
  const names = e.witness.blocks.map((b) => {
    let name = b.nodes.map((v) => source.names[v]!).join("_");
    while (used.has(name)) name += "'";
    used.add(name);
    return name;
  });
  const flags = trivialityFlags(e.succ, m);
  return {
    key,
    target: networkFromSuccessors(names, e.succ),
    witness: e.witness,
    times: [...e.times].sort((a, b) => a - b),
    encodings: e.encodings,
    flags,
    trivial: flags.length > 0,
    interactions: interactionCount(e.succ, m),
    firstUnit: e.firstUnit,
  };
}

/** Merge shard findings: the representative of a target is its occurrence in the earliest unit; then rank. */
export function mergeDiscoverShards(shards: readonly DiscoverShardResult[]): DiscoverResult {
  const best = new Map<string, DiscoveredTarget>();
  let encodingsChecked = 0;
  for (const shard of shards) {
    encodingsChecked += shard.encodingsChecked;
    for (const t of shard.targets) {
      const prev = best.get(t.key);
      if (!prev) {
        best.set(t.key, t);
        continue;
      }
      const [first, other] = prev.firstUnit <= t.firstUnit ? [prev, t] : [t, prev];
      const times = [...new Set([...first.times, ...other.times])].sort((a, b) => a - b);
      best.set(t.key, { ...first, times, encodings: first.encodings + other.encodings });
    }
  }
  const blockTotal = (d: DiscoveredTarget) => d.witness.blocks.reduce((s, b) => s + b.nodes.length, 0);
  const targets = [...best.values()].sort(
    (a, b) =>
      Number(a.trivial) - Number(b.trivial) ||
      b.target.names.length - a.target.names.length ||
      b.interactions - a.interactions ||
      a.times[0]! - b.times[0]! ||
      blockTotal(a) - blockTotal(b) ||
      (a.key < b.key ? -1 : a.key > b.key ? 1 : 0),
  );
  return { targets, encodingsChecked, totalUnits: shards[0]?.totalUnits ?? 0 };
}

/** Discover mode over all units in one run. */
export function discoverEmulatedTargets(
  source: BooleanNetwork,
  bounds: DiscoverBounds,
  control: SearchControl = {},
): DiscoverResult {
  return mergeDiscoverShards([discoverShard(source, bounds, control)]);
}
