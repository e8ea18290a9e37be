// Exhaustive enumeration of block encodings on a tabulated state space, the "exhaustive where it fits" side of the
// reductions search (block emulation as in Ollinger, "Intrinsic universality and cellular automata", Theoretical
// Computer Science, 2003).
//
// Without loss of generality (when context is allowed) a block is the set of nodes where its two codewords differ;
// nodes where they agree act as context. So an encoding is a base state s0 = e(0...0) plus disjoint blocks whose
// codeword for 1 flips the whole block, and s0 is taken as the smallest encoded state: every block's highest node
// is 0 in s0. Units are (t, s0); the enumeration prunes on block alignment of the images of the encoded states.
import { CancelledError, EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import type { BlockEmulationWitness } from "./block-witness";
import { powerTable, successorTable } from "./network-step";
import { shardRange, type UnitRange } from "./search-units";
import type { SearchControl } from "./given-target-search";

export const MAX_ENUMERATED_NODES = 20;

export interface EnumerationBounds {
  readonly maxTargetNodes: number;
  readonly maxTime: number;
  readonly maxBlock: number;
  readonly allowedNodes?: readonly number[];
  readonly contextAllowed?: boolean;
}

export interface FoundEncoding {
  readonly time: number;
  readonly s0: number;
  /** Block masks in order of smallest node; block k carries target node k. */
  readonly masks: readonly number[];
  /** The induced target map: succ[x] for x over 2^m target states. */
  readonly succ: readonly number[];
  readonly unit: number;
  /** The witness, built on request (absorbing spare nodes into blocks when context is not allowed). */
  witness(): BlockEmulationWitness;
}

export interface EnumerationRun {
  readonly range: UnitRange;
  readonly totalUnits: number;
  readonly encodingsChecked: number;
}

export function enumerationUnitCount(source: BooleanNetwork, maxTime: number): number {
  return maxTime * 2 ** source.names.length;
}

/**
 * Visit every consistent encoding with 1..maxTargetNodes blocks (or exactly `exactNodes`) in unit order; the visitor
 * returns true to stop the enumeration.
 */
export function enumerateEncodings(
  source: BooleanNetwork,
  bounds: EnumerationBounds,
  control: SearchControl,
  visit: (e: FoundEncoding) => boolean | void,
  exactNodes?: number,
): EnumerationRun {
  const n = source.names.length;
  if (n > MAX_ENUMERATED_NODES)
    throw new EngineError(
      "TOO_LARGE",
      `encodings are enumerated on at most ${MAX_ENUMERATED_NODES} source nodes (got ${n})`,
    );
  const M = bounds.maxTargetNodes;
  if (!(M >= 1 && M <= 4)) throw new EngineError("BAD_BOUNDS", "encodings are enumerated for targets of 1 to 4 nodes");
  if (!(bounds.maxTime >= 1) || !(bounds.maxBlock >= 1))
    throw new EngineError("BAD_BOUNDS", "time scale and block size bounds must be at least 1");
  const contextAllowed = bounds.contextAllowed ?? true;
  let allowedMask = 0;
  for (const v of bounds.allowedNodes ?? [...Array(n).keys()]) {
    if (!(v >= 0 && v < n)) throw new EngineError("BAD_BOUNDS", `allowed node ${v} is not a source node`);
    allowedMask |= 1 << v;
  }
  const fullMask = n === 0 ? 0 : (2 ** n - 1) >>> 0;
  const size = 2 ** n;
  const totalUnits = bounds.maxTime * size;
  const range =
    control.range ??
    (control.shard ? shardRange(totalUnits, control.shard.index, control.shard.count) : { start: 0, end: totalUnits });

  // Candidate blocks grouped by smallest node, each with its highest node.
  const blocksByMin: { mask: number; high: number; size: number }[][] = Array.from({ length: n }, () => []);
  const grow = (mask: number, last: number, count: number, min: number) => {
    blocksByMin[min]!.push({ mask, high: last, size: count });
    if (count === bounds.maxBlock) return;
    for (let v = last + 1; v < n; v++) if ((allowedMask >>> v) & 1) grow(mask | (1 << v), v, count + 1, min);
  };
  for (let v = 0; v < n; v++) if ((allowedMask >>> v) & 1) grow(1 << v, v, 1, v);

  const last = exactNodes ?? M;
  const step = successorTable(source);
  let encodingsChecked = 0;
  const blocks: { mask: number; size: number }[] = [];
  const blockMasks = new Int32Array(4);
  // Encoded state x of the current blocks, its image relative to s0 (z = F(state) xor s0), and per level the
  // target state that image encodes. Adding block m keeps states 0..2^m-1 and their images, so only the 2^m new
  // states are stepped; descendants never write below their parent's range.
  const states = new Int32Array(16);
  const images = new Int32Array(16);
  const encoded = new Int32Array(5 * 16);
  let Ft: Uint32Array = step;
  let FtTime = 0;
  const span = Math.max(1, range.end - range.start);
  let stopped = false;
  const absorbable = (U: number, m: number) => {
    const rest = ~U & fullMask;
    if ((rest & ~allowedMask) !== 0) return false;
    let spare = 0;
    for (let k = 0; k < m; k++) spare += bounds.maxBlock - blocks[k]!.size;
    return popcount(rest) <= spare;
  };
  for (let unit = Math.max(range.start, control.resumeFrom ?? range.start); unit < range.end && !stopped; unit++) {
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
    const F = Ft;
    const z0 = (F[s0]! ^ s0) >>> 0;
    // Every bit where s0's image differs from s0 must lie in some block: at most `last` blocks of allowed nodes.
    if (popcount(z0) > last * bounds.maxBlock || (z0 & ~allowedMask) !== 0) continue;
    states[0] = s0;
    images[0] = z0;
    encoded[0] = 0;
    // `uncovered`: image bits outside the blocks so far. A later block's smallest node must not exceed the lowest of
    // them (blocks come by increasing smallest node, so a lower bit could never be covered): the loop over v stops
    // there instead of trying blocks that can only fail.
    const extend = (level: number, union: number, minStart: number, uncovered: number) => {
      const vEnd = uncovered === 0 ? n - 1 : Math.min(n - 1, 31 - Math.clz32(uncovered & -uncovered));
      const half = 1 << level;
      const m = level + 1;
      const before = level * 16;
      const here = m * 16;
      for (let v = minStart; v <= vEnd && !stopped; v++) {
        for (const b of blocksByMin[v]!) {
          const bm = b.mask;
          if (bm & union || (s0 >>> b.high) & 1) continue;
          encodingsChecked++;
          // Every encoded state's image must be aligned with each chosen block and may leave uncovered bits only
          // at nodes a later block (smallest node above v) could still cover.
          let viable = true;
          for (let x = 0; x < half; x++) {
            const part = images[x]! & bm;
            if (part !== 0 && part !== bm) {
              viable = false;
              break;
            }
            encoded[here + x] = part === 0 ? encoded[before + x]! : encoded[before + x]! | half;
          }
          if (!viable) continue;
          blockMasks[level] = bm;
          const U = union | bm;
          const low = (1 << (v + 1)) - 1;
          let rest = uncovered & ~bm;
          for (let x = half; x < 2 * half; x++) {
            const state = states[x - half]! ^ bm;
            const z = (F[state]! ^ s0) >>> 0;
            let y = 0;
            for (let k = 0; k < m; k++) {
              const mask = blockMasks[k]!;
              const part = z & mask;
              if (part === 0) continue;
              if (part !== mask) {
                viable = false;
                break;
              }
              y |= 1 << k;
            }
            if (!viable) break;
            const r = z & ~U & fullMask;
            if ((r & low) !== 0) {
              viable = false;
              break;
            }
            rest |= r;
            states[x] = state;
            images[x] = z;
            encoded[here + x] = y;
          }
          // The remaining blocks (at most `last - m` of at most maxBlock nodes) must cover every uncovered bit.
          if (!viable || popcount(rest) > (last - m) * bounds.maxBlock) continue;
          blocks.push(b);
          if (rest === 0 && (exactNodes === undefined || exactNodes === m) && (contextAllowed || absorbable(U, m))) {
            const masks = Array.from(blockMasks.subarray(0, m));
            const found = new Found(t, s0, masks, Array.from(encoded.subarray(here, here + 2 * half)), unit, {
              n,
              union: U,
              contextAllowed,
              maxBlock: bounds.maxBlock,
            });
            if (visit(found)) stopped = true;
          }
          if (!stopped && m < last) extend(m, U, v + 1, rest);
          blocks.pop();
          if (stopped) break;
        }
      }
    };
    extend(0, 0, 0, z0);
  }
  if (!stopped) {
    control.onCursor?.(range.end);
    control.onProgress?.(1, "enumerating encodings");
  }
  return { range, totalUnits, encodingsChecked };
}

// A class rather than an object with a closure: hundreds of thousands are made per run, and a method costs no
// closure per encoding.
class Found implements FoundEncoding {
  constructor(
    readonly time: number,
    readonly s0: number,
    readonly masks: readonly number[],
    readonly succ: readonly number[],
    readonly unit: number,
    private readonly shape: { n: number; union: number; contextAllowed: boolean; maxBlock: number },
  ) {}

  witness(): BlockEmulationWitness {
    const { n, union, contextAllowed, maxBlock } = this.shape;
    return encodingWitness(n, this.masks, union, this.s0, this.time, contextAllowed, maxBlock);
  }
}

function popcount(x: number): number {
  let c = 0;
  for (let y = x >>> 0; y; y &= y - 1) c++;
  return c;
}

function encodingWitness(
  n: number,
  masks: readonly number[],
  union: number,
  s0: number,
  time: number,
  contextAllowed: boolean,
  maxBlock: number,
): BlockEmulationWitness {
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
