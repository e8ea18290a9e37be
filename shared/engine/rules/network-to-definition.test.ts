import fc from "fast-check";
import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import type { BooleanNetwork } from "../network";
import { compileDefinition } from "./compile-definition";
import { minimalSop, type Cube } from "./minimal-sop";
import { networkToDefinition, tableToExpr } from "./network-to-definition";
import { printExpr, printRuleText } from "./print-rule-text";
import { readRuleText } from "./parse-rule-text";

const coverValue = (cubes: Cube[], row: number) => (cubes.some((c) => (row & c.mask) === c.value) ? 1 : 0);

function randomNetwork(rng: () => number, n: number, maxK: number): BooleanNetwork {
  const regulators: Int32Array[] = [];
  const tables: Uint8Array[] = [];
  for (let i = 0; i < n; i++) {
    const k = Math.floor(rng() * (Math.min(maxK, n) + 1));
    const pool = Array.from({ length: n }, (_, j) => j);
    const regs: number[] = [];
    for (let j = 0; j < k; j++) regs.push(pool.splice(Math.floor(rng() * pool.length), 1)[0]!);
    regulators.push(Int32Array.from(regs));
    tables.push(Uint8Array.from({ length: 1 << k }, () => (rng() < 0.5 ? 1 : 0)));
  }
  return { names: Array.from({ length: n }, (_, i) => `g${i}`), regulators, tables };
}

const next = (net: BooleanNetwork, i: number, s: number) => {
  let row = 0;
  net.regulators[i]!.forEach((r, j) => (row |= ((s >> r) & 1) << j));
  return net.tables[i]![row]!;
};

describe("minimalSop", () => {
  it("minimalSop covers exactly the ones of random tables up to 13 inputs", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 13 }),
        fc.integer({ min: 1, max: 2 ** 31 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (k, seed, p) => {
          const rng = seedrandom(String(seed));
          const table = Uint8Array.from({ length: 1 << k }, () => (rng() < p ? 1 : 0));
          const cubes = minimalSop(table, k);
          for (let row = 0; row < table.length; row++) expect(coverValue(cubes, row)).toBe(table[row]);
        },
      ),
      { seed: 4301, numRuns: 120 },
    );
  });

  it("minimalSop finds the textbook minimum of the 3-input majority function (three two-literal terms)", () => {
    // common practice: majority(a, b, c) = ab + ac + bc is its unique minimal sum of products
    const table = Uint8Array.from({ length: 8 }, (_, r) => ((r & 1) + ((r >> 1) & 1) + ((r >> 2) & 1) >= 2 ? 1 : 0));
    expect(printExpr(tableToExpr(table, ["a", "b", "c"]))).toBe("a & b | a & c | b & c");
  });

  it("tableToExpr writes constants and single literals plainly", () => {
    expect(printExpr(tableToExpr(Uint8Array.from([0, 0]), ["a"]))).toBe("0");
    expect(printExpr(tableToExpr(Uint8Array.from([1, 1, 1, 1]), ["a", "b"]))).toBe("1");
    expect(printExpr(tableToExpr(Uint8Array.from([1, 0, 1, 0]), ["a", "b"]))).toBe("!a");
  });
});

describe("networkToDefinition", () => {
  it("networkToDefinition gives rules that compute the same next state as the network on random networks", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 8 }), fc.integer({ min: 1, max: 2 ** 31 }), (n, seed) => {
        const net = randomNetwork(seedrandom(String(seed)), n, 6);
        const back = compileDefinition(readRuleText(printRuleText(networkToDefinition(net))));
        for (let s = 0; s < 1 << n; s++) for (let i = 0; i < n; i++) expect(next(back, i, s)).toBe(next(net, i, s));
      }),
      { seed: 4302, numRuns: 150 },
    );
  });
});
