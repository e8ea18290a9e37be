// Discover mode: enumerate block encodings of 1..4 target nodes in a source network and keep every consistent one
// (the encoded set is closed under F^t, so the induced map is a target network), up to renaming and codeword swaps.
// Block emulation as in Ollinger, "Intrinsic universality and cellular automata", Theoretical Computer Science, 2003.
//
// Without loss of generality a block is the set of nodes where its two codewords differ (nodes where they agree act as
// context), so an encoding is a base state s0 = e(0...0) and disjoint blocks whose codeword for 1 flips the whole
// block; s0 is taken to be the smallest encoded state, which means every block's highest node is 0 in s0.
import { CancelledError, EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import type { BlockEmulationWitness } from "./block-witness";
import { canonicalTargetKey, interactionCount, trivialityFlags, type TargetFlag } from "./canonical-target";
import { networkFromSuccessors } from "./network-from-successors";
import { powerTable, successorTable } from "./network-step";
import { shardRange, type UnitRange } from "./search-units";
import type { SearchControl } from "./given-target-search";

export const MAX_DISCOVER_NODES = 20;

export interface DiscoverBounds {
  readonly maxTargetNodes: number;
  readonly maxTime: number;
  readonly maxBlock: number;
  readonly allowedNodes?: readonly number[];
  readonly contextAllowed?: boolean;
}

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
  return bounds.maxTime * 2 ** source.names.length;
}

/** Run the discover enumeration over one shard (or all units) and return its findings in unit order. */
export function discoverShard(source: BooleanNetwork, bounds: DiscoverBounds, control: SearchControl = {}): DiscoverShardResult {
  const n = source.names.length;
  if (n > MAX_DISCOVER_NODES) throw new EngineError("TOO_LARGE", `discover enumerates state spaces of at most ${MAX_DISCOVER_NODES} nodes (got ${n})`);
  const M = bounds.maxTargetNodes;
  if (!(M >= 1 && M <= 4)) throw new EngineError("BAD_BOUNDS", "discover looks for targets of 1 to 4 nodes");
  if (!(bounds.maxTime >= 1) || !(bounds.maxBlock >= 1)) throw new EngineError("BAD_BOUNDS", "time scale and block size bounds must be at least 1");
  const contextAllowed = bounds.contextAllowed ?? true;
  let allowedMask = 0;
  for (const v of bounds.allowedNodes ?? [...Array(n).keys()]) {
    if (!(v >= 0 && v < n)) throw new EngineError("BAD_BOUNDS", `allowed node ${v} is not a source node`);
    allowedMask |= 1 << v;
  }
  const fullMask = n === 0 ? 0 : (2 ** n - 1) >>> 0;
  const size = 2 ** n;
  const totalUnits = bounds.maxTime * size;
  const range = control.range ?? (control.shard ? shardRange(totalUnits, control.shard.index, control.shard.count) : { start: 0, end: totalUnits });

  // Candidate blocks grouped by smallest node, each with its highest node.
  const blocksByMin: { mask: number; high: number; size: number }[][] = Array.from({ length: n }, () => []);
  const grow = (mask: number, last: number, count: number, min: number) => {
    blocksByMin[min]!.push({ mask, high: last, size: count });
    if (count === bounds.maxBlock) return;
    for (let v = last + 1; v < n; v++) if ((allowedMask >>> v) & 1) grow(mask | (1 << v), v, count + 1, min);
  };
  for (let v = 0; v < n; v++) if ((allowedMask >>> v) & 1) grow(1 << v, v, 1, v);

  const step = successorTable(source);
  const found = new Map<string, { succ: number[]; witness: BlockEmulationWitness; times: number[]; encodings: number; firstUnit: number }>();
  let encodingsChecked = 0;
  const blocks: { mask: number; size: number }[] = [];
  const encoded = new Int32Array(16);

  let Ft: Uint32Array | null = null;
  let FtTime = 0;
  const span = Math.max(1, range.end - range.start);
  let unit = Math.max(range.start, control.resumeFrom ?? range.start);
  for (; unit < range.end; unit++) {
    if ((unit & 255) === 0) {
      if (control.shouldStop?.()) throw new CancelledError();
      control.onCursor?.(unit);
      control.onProgress?.((unit - range.start) / span, "enumerating encodings");
    }
    const t = Math.floor(unit / size) + 1;
    const s0 = unit % size;
    if (FtTime !== t) {
      Ft = powerTable(step, t);
      FtTime = t;
    }
    const F = Ft!;
    const extend = (level: number, union: number, minStart: number) => {
      for (let v = minStart; v < n; v++) {
        for (const b of blocksByMin[v]!) {
          if (b.mask & union || (s0 >>> b.high) & 1) continue;
          blocks.push(b);
          const m = level + 1;
          const U = union | b.mask;
          encodingsChecked++;
          // Every encoded state's image must be aligned with each chosen block and may leave uncovered bits only
          // at nodes a later block (smallest node above v) could still cover.
          let closed = true;
          let viable = true;
          for (let x = 0; x < 1 << m && viable; x++) {
            let state = s0;
            for (let k = 0; k < m; k++) if ((x >>> k) & 1) state ^= blocks[k]!.mask;
            const z = (F[state]! ^ s0) >>> 0;
            let y = 0;
            for (let k = 0; k < m; k++) {
              const part = z & blocks[k]!.mask;
              if (part === 0) continue;
              if (part !== blocks[k]!.mask) {
                viable = false;
                break;
              }
              y |= 1 << k;
            }
            const rest = z & ~U & fullMask;
            if (rest !== 0) {
              closed = false;
              if ((rest & ((1 << (v + 1)) - 1)) !== 0) viable = false;
            }
            encoded[x] = y;
          }
          if (viable && closed && (contextAllowed || absorbable(U, m))) record(m, U, t, s0);
          if (viable && m < M) extend(m, U, v + 1);
          blocks.pop();
        }
      }
    };
    const absorbable = (U: number, m: number) => {
      const rest = ~U & fullMask;
      if ((rest & ~allowedMask) !== 0) return false;
      let spare = 0;
      for (let k = 0; k < m; k++) spare += bounds.maxBlock - blocks[k]!.size;
      return popcount(rest) <= spare;
    };
    const record = (m: number, U: number, t: number, s0v: number) => {
      const succ = Array.from(encoded.subarray(0, 1 << m));
      const key = canonicalTargetKey(succ, m);
      const entry = found.get(key);
      if (entry) {
        entry.encodings++;
        if (!entry.times.includes(t)) entry.times.push(t);
        return;
      }
      found.set(key, { succ, witness: makeWitness(n, blocks.slice(0, m).map((b) => b.mask), U, s0v, t, contextAllowed, bounds.maxBlock), times: [t], encodings: 1, firstUnit: unit });
    };
    extend(0, 0, 0);
  }
  control.onCursor?.(range.end);
  control.onProgress?.(1, "enumerating encodings");
  const targets = [...found.entries()].map(([key, e]) => describe(source, key, e));
  return { range, totalUnits, encodingsChecked, targets };
}

function popcount(x: number): number {
  let c = 0;
  for (let y = x >>> 0; y; y &= y - 1) c++;
  return c;
}

function makeWitness(n: number, masks: number[], union: number, s0: number, time: number, contextAllowed: boolean, maxBlock: number): BlockEmulationWitness {
  const nodesOf = masks.map((mask) => [...Array(n).keys()].filter((v) => (mask >>> v) & 1));
  if (!contextAllowed) {
    // Nodes outside every block join a block with room, carrying the same value in both codewords.
    let k = 0;
    for (let v = 0; v < n; v++) {
      if ((union >>> v) & 1) continue;
      while (nodesOf[k]!.length >= maxBlock) k++;
      nodesOf[k]!.push(v);
    }
  }
  const blocks = nodesOf.map((nodes, j) => {
    const sorted = [...nodes].sort((a, b) => a - b);
    const zero = sorted.map((v) => (s0 >>> v) & 1);
    const one = sorted.map((v, i) => ((masks[j]! >>> v) & 1 ? 1 - zero[i]! : zero[i]!));
    return { nodes: sorted, zero, one };
  });
  const inBlock = new Uint8Array(n);
  for (const b of blocks) for (const v of b.nodes) inBlock[v] = 1;
  const context = [...Array(n).keys()].map((v) => (inBlock[v] ? -1 : (s0 >>> v) & 1));
  return { time, blocks, context };
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
