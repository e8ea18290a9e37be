// The block map of block emulation (Delorme, Mazoyer, Ollinger, Theyssier, "Bulking I: an abstract theory of
// bulking", Theor. Comput. Sci. 412, 2011): the middle k cells left after t steps of F on three k-cell words x y z.
// Evaluated through per-rule lookup tables that advance 8-cell chunks several steps at once.
import { EngineError } from "../errors";
import type { RuleTable } from "../automata";
import { stepPackedWord } from "../automata";

/** Block sizes beyond this would make the 2^k-word enumerations of the search impractical. */
export const MAX_SEARCH_BLOCK = 20;

export interface MiddleBlockMap {
  readonly block: number;
  readonly time: number;
  /** The middle `block` cells after `time` steps of the rule on x y z (packed words, bit i = cell i). */
  middle(x: number, y: number, z: number): number;
}

/**
 * Per-rule tables: entry w (8 + 2rs cells) -> the 8 cells left after s steps. Kept for the few most recent rules
 * (keyed by radius and table) because a hierarchy run asks for the same rule at every block size.
 */
const chunkTables = new Map<string, Map<number, Uint8Array>>();
const CACHED_RULES = 16;

function ruleKey(rule: RuleTable): string {
  return `${rule.radius}:${rule.table.join("")}`;
}

function chunkTable(rule: RuleTable, steps: number): Uint8Array {
  const key = ruleKey(rule);
  let perRule = chunkTables.get(key);
  if (perRule) {
    chunkTables.delete(key);
  } else {
    perRule = new Map();
    if (chunkTables.size >= CACHED_RULES) chunkTables.delete(chunkTables.keys().next().value!);
  }
  chunkTables.set(key, perRule);
  let table = perRule.get(steps);
  if (!table) {
    table = buildChunkTable(rule, steps);
    perRule.set(steps, table);
  }
  return table;
}

/**
 * s steps on every (8 + 2rs)-cell word: one step through the one-step table of 8-cell chunks, then the cached
 * (s-1)-step table, so each table costs a few lookups per entry.
 */
function buildChunkTable(rule: RuleTable, steps: number): Uint8Array {
  const r = rule.radius;
  if (steps > 1) {
    const one = chunkTable(rule, 1);
    const oneMask = one.length - 1;
    const prev = chunkTable(rule, steps - 1);
    const prevMask = prev.length - 1;
    const prevBits = 8 + 2 * r * (steps - 1);
    const table = new Uint8Array(1 << (8 + 2 * r * steps));
    for (let w = 0; w < table.length; w++) {
      let v = 0;
      for (let shift = 0; shift < prevBits; shift += 8) v |= one[(w >>> shift) & oneMask]! << shift;
      table[w] = prev[v & prevMask]!;
    }
    return table;
  }
  const one = new Uint8Array(1 << (8 + 2 * r));
  if (r === 1) {
    for (let w = 0; w < one.length; w++) one[w] = stepPackedWord(rule, w) & 255;
  } else {
    // wide neighbourhoods have too many minterms for the bit-parallel step; index the table cell by cell
    for (let w = 0; w < one.length; w++) {
      let out = 0;
      for (let i = 0; i < 8; i++) {
        let idx = 0;
        for (let j = 0; j <= 2 * r; j++) idx = (idx << 1) | ((w >>> (i + j)) & 1);
        out |= rule.table[idx]! << i;
      }
      one[w] = out;
    }
  }
  return one;
}

export function checkBlockParameters(rule: RuleTable, block: number, time: number, maxBlock = MAX_SEARCH_BLOCK): void {
  if (!Number.isInteger(block) || block < 1 || block > maxBlock) {
    throw new EngineError("BAD_BLOCK", `the block size is an integer 1..${maxBlock}, got ${block}`);
  }
  if (!Number.isInteger(time) || time < 1 || time > block) {
    throw new EngineError("BAD_TIME", `the time scale is an integer 1..block (${block}), got ${time}`);
  }
  if (rule.radius * time > block) {
    throw new EngineError("BAD_TIME", `radius ${rule.radius} times time ${time} exceeds the block size ${block}`);
  }
}

export function middleBlockMap(rule: RuleTable, block: number, time: number): MiddleBlockMap {
  checkBlockParameters(rule, block, time);
  const r = rule.radius;
  if (r > 4) throw new EngineError("BAD_RULE", `the block search handles radius up to 4, got ${r}`);
  const k = block;
  const reach = r * time;
  const perLayer = Math.floor(4 / r);
  // layer plan: full layers of `perLayer` steps, then one shorter layer for the remainder
  const layerTables: Uint8Array[] = [];
  const layerMasks: number[] = [];
  const layerBytes: number[] = [];
  let width = k + 2 * reach;
  for (let done = 0; done < time;) {
    const s = Math.min(perLayer, time - done);
    layerTables.push(chunkTable(rule, s));
    layerMasks.push((1 << (8 + 2 * r * s)) - 1);
    width -= 2 * r * s;
    layerBytes.push(Math.ceil(width / 8));
    done += s;
  }
  const layers = layerTables.length;
  const skip = k - reach;
  // the word the middle block depends on, x[skip..k) y z[0..reach), is at most 3 * MAX_SEARCH_BLOCK = 60 cells: it
  // travels as two 32-bit halves into eight byte variables, so no call touches an array beyond the lookup tables
  const yShift = reach;
  const zShift = reach + k;
  const rightMask = reach >= 31 ? -1 : (1 << reach) - 1;
  const outMask = k >= 31 ? -1 : (1 << k) - 1;
  return {
    block,
    time,
    middle(x: number, y: number, z: number): number {
      const zr = z & rightMask;
      const lo = (x >>> skip) | (y << yShift) | (zShift < 32 ? zr << zShift : 0);
      const hi = (y >>> (32 - yShift)) | (zShift < 32 ? zr >>> (32 - zShift) : zr << (zShift - 32));
      let b0 = lo & 255;
      let b1 = (lo >>> 8) & 255;
      let b2 = (lo >>> 16) & 255;
      let b3 = lo >>> 24;
      let b4 = hi & 255;
      let b5 = (hi >>> 8) & 255;
      let b6 = (hi >>> 16) & 255;
      let b7 = hi >>> 24;
      // byte m of a layer reads bytes m and m+1 of the previous one, so ascending m never reads a byte it has already
      // overwritten; bytes past a layer's width go stale and only ever reach cells past it
      for (let l = 0; l < layers; l++) {
        const tab = layerTables[l]!;
        const mask = layerMasks[l]!;
        const nb = layerBytes[l]!;
        b0 = tab[(b0 | (b1 << 8)) & mask]!;
        if (nb > 1) {
          b1 = tab[(b1 | (b2 << 8)) & mask]!;
          if (nb > 2) {
            b2 = tab[(b2 | (b3 << 8)) & mask]!;
            if (nb > 3) {
              b3 = tab[(b3 | (b4 << 8)) & mask]!;
              if (nb > 4) {
                b4 = tab[(b4 | (b5 << 8)) & mask]!;
                if (nb > 5) {
                  b5 = tab[(b5 | (b6 << 8)) & mask]!;
                  if (nb > 6) {
                    b6 = tab[(b6 | (b7 << 8)) & mask]!;
                    if (nb > 7) b7 = tab[b7 & mask]!;
                  }
                }
              }
            }
          }
        }
      }
      return (b0 | (b1 << 8) | (b2 << 16)) & outMask;
    },
  };
}
