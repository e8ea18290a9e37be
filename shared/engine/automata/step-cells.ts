// One synchronous step of a radius-r rule (Wolfram, "Statistical mechanics of cellular automata", Rev. Mod. Phys.
// 55, 1983) on a finite word, which loses r cells at each end, or on a ring (periodic boundary), over plain cell
// arrays and over bit-packed words (bit i = cell i, leftmost cell first).
import { EngineError } from "../errors";
import type { RuleTable } from "./rule-table";

/** Step a finite word: cell i of the result is the rule applied to cells i..i+2r, so the result is 2r shorter. */
export function stepWord(rule: RuleTable, cells: Uint8Array): Uint8Array {
  const span = 2 * rule.radius + 1;
  const n = cells.length - span + 1;
  if (n < 0)
    throw new EngineError(
      "WORD_TOO_SHORT",
      `a word of ${cells.length} cells has no cells left after a radius-${rule.radius} step`,
    );
  const out = new Uint8Array(n);
  const mask = rule.table.length - 1;
  let idx = 0;
  for (let j = 0; j < span - 1; j++) idx = (idx << 1) | cells[j]!;
  for (let i = 0; i < n; i++) {
    idx = ((idx << 1) | cells[i + span - 1]!) & mask;
    out[i] = rule.table[idx]!;
  }
  return out;
}

/** Step a ring of cells: the neighbours of the ends wrap around. */
export function stepRing(rule: RuleTable, cells: Uint8Array): Uint8Array {
  const n = cells.length;
  const r = rule.radius;
  if (n === 0) return new Uint8Array(0);
  const padded = new Uint8Array(n + 2 * r);
  for (let i = 0; i < padded.length; i++) padded[i] = cells[(((i - r) % n) + n) % n]!;
  return stepWord(rule, padded);
}

/**
 * Step a bit-packed word of up to 32 cells: bit i of the result is the rule applied to cells i..i+2r, bit-parallel
 * over the minterms of the rule. Bits at and above width-2r of the result are not meaningful.
 */
export function stepPackedWord(rule: RuleTable, word: number): number {
  const span = 2 * rule.radius + 1;
  let out = 0;
  const t = rule.table;
  for (let e = 0; e < t.length; e++) {
    if (!t[e]) continue;
    let term = -1;
    for (let j = 0; j < span; j++) {
      const shifted = word >>> j;
      term &= (e >> (span - 1 - j)) & 1 ? shifted : ~shifted;
    }
    out |= term;
  }
  return out;
}
