// Discover mode: enumerate block encodings of 1..4 target nodes in a source network and keep every consistent one
// (the encoded set is closed under F^t, so the induced map is a target network), up to renaming and codeword swaps.
// Block emulation as in Ollinger, "Intrinsic universality and cellular automata", Theoretical Computer Science, 2003.
import type { BooleanNetwork } from "../network";
import type { BlockEmulationWitness } from "./block-witness";
import { canonicalTargetKey, interactionCount, trivialityFlags, type TargetFlag } from "./canonical-target";
import { networkFromSuccessors } from "./network-from-successors";
import type { UnitRange } from "./search-units";
import type { SearchControl } from "./given-target-search";
import { enumerateEncodings, enumerationUnitCount, type EnumerationBounds } from "./encoding-enumeration";

export type DiscoverBounds = EnumerationBounds;

export interface DiscoveredTarget {
  /** Canonical form of the target map; equal keys mean equal targets up to renaming and codeword swaps. */
  readonly key: string;
  readonly target: BooleanNetwork;
  readonly witness: BlockEmulationWitness;
  /** Time scales at which some encoding shows this target. */
  readonly times: number[];
  /** Encodings (base state, blocks, time) showing it. */
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
  readonly encodingsChecked: number;
  readonly targets: DiscoveredTarget[];
}

export interface DiscoverResult {
  /** Ranked: non-trivial first, then more target nodes, more interactions, smaller time scale, smaller blocks. */
  readonly targets: DiscoveredTarget[];
  readonly encodingsChecked: number;
  readonly totalUnits: number;
}

export function discoverUnitCount(source: BooleanNetwork, bounds: DiscoverBounds): number {
  return enumerationUnitCount(source, bounds.maxTime);
}

/** Run the discover enumeration over one shard (or all units) and return its findings in unit order. */
export function discoverShard(source: BooleanNetwork, bounds: DiscoverBounds, control: SearchControl = {}): DiscoverShardResult {
  const found = new Map<string, { succ: number[]; witness: BlockEmulationWitness; times: number[]; encodings: number; firstUnit: number }>();
  const run = enumerateEncodings(source, bounds, control, (e) => {
    const m = e.masks.length;
    const key = canonicalTargetKey(e.succ, m);
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
export function discoverEmulatedTargets(source: BooleanNetwork, bounds: DiscoverBounds, control: SearchControl = {}): DiscoverResult {
  return mergeDiscoverShards([discoverShard(source, bounds, control)]);
}
