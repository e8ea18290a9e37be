// The plain all-pairs reference for block emulation (definition of "Bulking I", Delorme et al., Theor. Comput.
// Sci. 412, 2011): every ordered pair of distinct k-cell words is simulated cell by cell. Kept to test the fast
// search and to measure it in the benchmark; it has its own simulation loop.
import { CancelledError } from "../errors";
import type { RuleTable } from "../automata";
import { ecaRule } from "../automata";
import type { Emulation } from "./block-emulations";

export interface NaiveResult {
  readonly emulations: Emulation[];
  readonly pairsExamined: number;
}

function wordText(w: number, k: number): string {
  let s = "";
  for (let i = 0; i < k; i++) s += (w >> i) & 1 ? "1" : "0";
  return s;
}

/** All targets of `rule` at block k and time t by trying every ordered pair (u0, u1), first witness kept. */
export function naiveEmulations(rule: RuleTable, k: number, t = k, shouldStop?: () => boolean): NaiveResult {
  const r = rule.radius;
  const size = 1 << k;
  const width = 3 * k;
  const a = new Uint8Array(width);
  const b = new Uint8Array(width);
  const words: Uint8Array[] = [];
  for (let w = 0; w < size; w++) {
    const cells = new Uint8Array(k);
    for (let i = 0; i < k; i++) cells[i] = (w >> i) & 1;
    words.push(cells);
  }
  const tableMask = rule.table.length - 1;
  const found = new Map<number, Emulation>();
  let pairs = 0;
  for (let x0 = 0; x0 < size; x0++) {
    if (shouldStop && shouldStop()) throw new CancelledError();
    for (let x1 = 0; x1 < size; x1++) {
      if (x0 === x1) continue;
      pairs++;
      let g = 0;
      let ok = true;
      for (let p = 0; p < 8 && ok; p++) {
        a.set(words[p & 4 ? x1 : x0]!, 0);
        a.set(words[p & 2 ? x1 : x0]!, k);
        a.set(words[p & 1 ? x1 : x0]!, 2 * k);
        let cur = a;
        let nxt = b;
        let len = width;
        for (let s = 0; s < t; s++) {
          // slide the neighbourhood index along the word: drop the leftmost cell, append the next one
          let index = 0;
          for (let j = 0; j < 2 * r; j++) index = 2 * index + cur[j]!;
          for (let i = 0; i < len - 2 * r; i++) {
            index = (2 * index + cur[i + 2 * r]!) & tableMask;
            nxt[i] = rule.table[index]!;
          }
          len -= 2 * r;
          [cur, nxt] = [nxt, cur];
        }
        const off = k - r * t;
        let is0 = true;
        let is1 = true;
        for (let i = 0; i < k; i++) {
          const v = cur[off + i]!;
          if (v !== ((x0 >> i) & 1)) is0 = false;
          if (v !== ((x1 >> i) & 1)) is1 = false;
        }
        if (is1) g |= 1 << p;
        else if (!is0) ok = false;
      }
      if (ok && !found.has(g)) found.set(g, { target: g, u0: wordText(x0, k), u1: wordText(x1, k) });
    }
  }
  return { emulations: [...found.values()].sort((p, q) => p.target - q.target), pairsExamined: pairs };
}

export interface NaiveMinBlocks {
  /** minBlock[256 * F + G]: the least k <= maxBlock with F -> G, 0 if none. */
  readonly minBlock: Uint8Array;
  readonly pairsExamined: number;
}

/** The naive hierarchy table: every listed source rule (default all 256), every k, every pair. */
export function naiveEcaMinBlocks(
  maxBlock: number,
  options: {
    sources?: readonly number[];
    blocks?: readonly number[];
    onProgress?: (fraction: number, phase: string) => void;
    shouldStop?: () => boolean;
  } = {},
): NaiveMinBlocks {
  const sources = options.sources ?? Array.from({ length: 256 }, (_, i) => i);
  const blocks = options.blocks ?? Array.from({ length: maxBlock }, (_, i) => i + 1);
  const minBlock = new Uint8Array(65536);
  let pairs = 0;
  let done = 0;
  for (const k of blocks) {
    for (const f of sources) {
      const res = naiveEmulations(ecaRule(f), k, k, options.shouldStop);
      pairs += res.pairsExamined;
      for (const e of res.emulations) {
        const cell = 256 * f + e.target;
        if (minBlock[cell] === 0 || minBlock[cell]! > k) minBlock[cell] = k;
      }
      done++;
      options.onProgress?.(done / (blocks.length * sources.length), `naive k=${k}`);
    }
  }
  return { minBlock, pairsExamined: pairs };
}
