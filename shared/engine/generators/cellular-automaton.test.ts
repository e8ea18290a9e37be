import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { BooleanNetwork } from "../network";
import { stateFromString, stateToString } from "../network";
import { cellularAutomaton } from "./cellular-automaton";

function step(net: BooleanNetwork, state: number): number {
  let t = 0;
  net.names.forEach((_, i) => {
    let row = 0;
    net.regulators[i]!.forEach((r, j) => (row |= ((state >> r) & 1) << j));
    t |= net.tables[i]![row]! << i;
  });
  return t;
}

/** The rule-number definition read directly: bit (sum of neighbour bits, leftmost most significant) of the rule. */
function referenceStep(cells: string, rule: bigint, r: number): string {
  const n = cells.length;
  let out = "";
  for (let i = 0; i < n; i++) {
    let v = 0n;
    for (let d = -r; d <= r; d++) v = v * 2n + BigInt(cells[(((i + d) % n) + n) % n]!);
    out += String((rule >> v) & 1n);
  }
  return out;
}

describe("cellularAutomaton", () => {
  it("cellularAutomaton names cells c0.. and gives cell i the regulators i-1, i, i+1 around the ring", () => {
    const net = cellularAutomaton({ cells: 5, rule: 110 });
    expect(net.names).toEqual(["c0", "c1", "c2", "c3", "c4"]);
    expect(Array.from(net.regulators[0]!)).toEqual([4, 0, 1]);
    expect(Array.from(net.regulators[4]!)).toEqual([3, 4, 0]);
  });

  it("cellularAutomaton matches the rule-number definition for every elementary rule on random rings", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 255 }),
        fc.integer({ min: 3, max: 16 }),
        fc.integer({ min: 0, max: 2 ** 16 - 1 }),
        (rule, n, bits) => {
          const state = bits & ((1 << n) - 1);
          const net = cellularAutomaton({ cells: n, rule });
          expect(stateToString(step(net, state), n)).toBe(referenceStep(stateToString(state, n), BigInt(rule), 1));
        },
      ),
      { seed: 4401, numRuns: 400 },
    );
  });

  it("cellularAutomaton matches the rule-number definition for radius 2 and 3 rules", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 3 }),
        fc.bigInt({ min: 0n, max: (1n << 128n) - 1n }),
        fc.integer({ min: 0, max: 2 ** 14 - 1 }),
        (r, big, bits) => {
          const n = 14;
          const rule = r === 2 ? big % (1n << 32n) : big;
          const net = cellularAutomaton({ cells: n, rule, radius: r });
          expect(stateToString(step(net, bits), n)).toBe(referenceStep(stateToString(bits, n), rule, r));
        },
      ),
      { seed: 4402, numRuns: 200 },
    );
  });

  it("cellularAutomaton rule 30 grows the published pattern from a single live cell", () => {
    // Wolfram, "Statistical mechanics of cellular automata", Rev. Mod. Phys. 1983, rule 30 figure; rows from memory.
    const net = cellularAutomaton({ cells: 11, rule: 30 });
    const rows = ["00000100000"];
    for (let t = 0; t < 4; t++) rows.push(stateToString(step(net, stateFromString(rows[t]!)), 11));
    expect(rows).toEqual(["00000100000", "00001110000", "00011001000", "00110111100", "01100100010"]);
  });

  it("cellularAutomaton rule 90 draws Pascal's triangle mod 2 from a single live cell", () => {
    // common practice: rule 90 is the sum of the two neighbours mod 2, so cell d at time t is C(t, (t+d)/2) mod 2.
    const n = 31;
    const net = cellularAutomaton({ cells: n, rule: 90 });
    let state = stateFromString("0".repeat(15) + "1" + "0".repeat(15));
    const binom = (t: number, k: number): number => {
      let c = 1;
      for (let j = 0; j < k; j++) c = (c * (t - j)) / (j + 1);
      return c;
    };
    for (let t = 1; t <= 15; t++) {
      state = step(net, state);
      const text = stateToString(state, n);
      for (let d = -15; d <= 15; d++) {
        const expected = (t + d) % 2 === 0 && Math.abs(d) <= t ? binom(t, (t + d) / 2) % 2 : 0;
        expect(Number(text[15 + d])).toBe(expected);
      }
    }
  });

  it("cellularAutomaton rejects rings too small for the neighbourhood and out-of-range rule numbers", () => {
    expect(() => cellularAutomaton({ cells: 2, rule: 30 })).toThrow(/at least 3 cells/);
    expect(() => cellularAutomaton({ cells: 8, rule: 256 })).toThrow(/out of range/);
    expect(() => cellularAutomaton({ cells: 8, rule: -1 })).toThrow(/non-negative/);
  });
});
