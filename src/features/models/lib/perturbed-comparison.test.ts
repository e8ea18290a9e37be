import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { runScreen } from "@shared/engine/screens";
import type { BooleanNetwork } from "@shared/engine/network";
import { randomNK, slowSuccessor, text } from "@shared/engine/update/random-networks.test-support";
import { perturbedComparison } from "./perturbed-comparison";

const names = (n: number) => Array.from({ length: n }, (_, i) => `g${i}`);

/** Brute force: follow every state, one step at a time, under the successor with the held bits overwritten. */
function referenceCycles(net: BooleanNetwork, held: Record<number, 0 | 1>, phenotype: Record<number, 0 | 1>) {
  const n = net.names.length;
  const step = (s: number) => {
    let t = slowSuccessor(net, s);
    for (const [node, v] of Object.entries(held)) t = v ? t | (1 << Number(node)) : t & ~(1 << Number(node));
    return t;
  };
  const basin = new Map<string, number>();
  let phenotypeStates = 0;
  for (let s = 0; s < 2 ** n; s++) {
    const path: number[] = [];
    let x = s;
    while (!path.includes(x)) {
      path.push(x);
      x = step(x);
    }
    const cycle = path
      .slice(path.indexOf(x))
      .map((c) => text(c, n))
      .sort();
    const key = cycle.join(",");
    basin.set(key, (basin.get(key) ?? 0) + 1);
    if (Object.entries(phenotype).every(([node, v]) => cycle.every((c) => c[Number(node)] === String(v))))
      phenotypeStates++;
  }
  return { basin, share: phenotypeStates / 2 ** n };
}

const sortedKey = (states: readonly string[]) => [...states].sort().join(",");

const caseArb = fc
  .record({ n: fc.integer({ min: 1, max: 7 }), k: fc.integer({ min: 1, max: 3 }), seed: fc.integer() })
  .chain((c) =>
    fc.record({
      c: fc.constant(c),
      held: fc
        .uniqueArray(fc.tuple(fc.integer({ min: 0, max: c.n - 1 }), fc.constantFrom<0 | 1>(0, 1)), {
          selector: ([i]) => i,
          minLength: 1,
          maxLength: Math.min(3, c.n),
        })
        .map((e) => Object.fromEntries(e) as Record<number, 0 | 1>),
      phenotype: fc
        .uniqueArray(fc.tuple(fc.integer({ min: 0, max: c.n - 1 }), fc.constantFrom<0 | 1>(0, 1)), {
          selector: ([i]) => i,
          maxLength: 2,
        })
        .map((e) => Object.fromEntries(e) as Record<number, 0 | 1>),
    }),
  );

const byName = (r: Record<number, 0 | 1>) =>
  Object.fromEntries(Object.entries(r).map(([i, v]) => [`g${i}`, v])) as Record<string, 0 | 1>;

describe("perturbedComparison", () => {
  it("perturbedComparison of the toggle switch with B knocked out keeps A=1, B=0 with the whole state space", () => {
    // Common practice (the textbook two-gene toggle switch), worked out by hand: under synchronous update
    // A' = !B, B' = !A has fixed points 10 and 01 (one state each as basin) and the 2-cycle 00 <-> 11; holding B at 0
    // makes A' = 1, so every state reaches 10.
    const net = compileDefinition(readRuleText("A' = !B\nB' = !A\n"));
    const c = perturbedComparison(net, { B: 0 }, { A: 1 });
    expect(c.method).toBe("exact-synchronous");
    expect(c.kept.map((k) => [k.before.states, k.before.share, k.after.share])).toEqual([[["10"], 0.25, 1]]);
    expect(c.lost.map((a) => sortedKey(a.states)).sort()).toEqual(["00,11", "01"]);
    expect(c.gained).toEqual([]);
    expect([c.phenotypeShareBefore, c.phenotypeShareAfter]).toEqual([0.25, 1]);
  });

  it("perturbedComparison finds the attractors, basins and phenotype share a state-by-state walk finds", () => {
    fc.assert(
      fc.property(caseArb, ({ c, held, phenotype }) => {
        const net = randomNK(c.n, c.k, c.seed);
        const cmp = perturbedComparison(net, byName(held), byName(phenotype));
        const before = referenceCycles(net, {}, phenotype);
        const after = referenceCycles(net, held, phenotype);
        const stateCount = 2 ** c.n;
        const listed = (list: readonly { states: readonly string[]; share: number | null }[]) =>
          new Map(list.map((a) => [sortedKey(a.states), a.share! * stateCount]));
        const beforeAll = [...cmp.kept.map((k) => k.before), ...cmp.lost];
        const afterAll = [...cmp.kept.map((k) => k.after), ...cmp.gained];
        expect(listed(beforeAll)).toEqual(before.basin);
        expect(listed(afterAll)).toEqual(after.basin);
        expect(new Set(cmp.kept.map((k) => sortedKey(k.before.states)))).toEqual(
          new Set([...before.basin.keys()].filter((k) => after.basin.has(k))),
        );
        expect(cmp.phenotypeShareBefore).toBeCloseTo(before.share, 12);
        expect(cmp.phenotypeShareAfter).toBeCloseTo(after.share, 12);
        expect([cmp.beforeCount, cmp.afterCount]).toEqual([before.basin.size, after.basin.size]);
      }),
      { seed: 1504, numRuns: 120 },
    );
  });

  it("perturbedComparison agrees with every row of the screen it is opened from", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 8 }), fc.integer(), (n, seed) => {
        const net = randomNK(n, 2, seed);
        const phenotype = { g0: 1 as const };
        const screen = runScreen(net, { nodes: names(n).slice(0, 3), pairs: true, phenotype });
        for (const row of screen.rows) {
          const cmp = perturbedComparison(net, row.perturbation, phenotype);
          expect(cmp.phenotypeShareAfter).toBeCloseTo(row.basinShare!, 12);
          expect([cmp.afterCount, cmp.lost.length, cmp.gained.length]).toEqual([
            row.attractorsAfter,
            row.attractorsLost,
            row.attractorsGained,
          ]);
        }
      }),
      { seed: 15, numRuns: 30 },
    );
  });

  it("perturbedComparison above the exact limit lists the fixed points by SAT, the exact analysis's fixed points", () => {
    fc.assert(
      fc.property(caseArb, ({ c, held, phenotype }) => {
        const net = randomNK(c.n, c.k, c.seed);
        const exact = perturbedComparison(net, byName(held), byName(phenotype));
        const sat = perturbedComparison(net, byName(held), byName(phenotype), 0);
        expect(sat.method).toBe("sat-fixed-points");
        expect(sat.phenotypeShareAfter).toBeNull();
        const fixed = (list: readonly { states: readonly string[] }[]) =>
          list
            .filter((a) => a.states.length === 1)
            .map((a) => a.states[0])
            .sort();
        expect(fixed(sat.lost)).toEqual(fixed(exact.lost));
        expect(fixed(sat.gained)).toEqual(fixed(exact.gained));
        expect(fixed(sat.kept.map((k) => k.after))).toEqual(fixed(exact.kept.map((k) => k.after)));
      }),
      { seed: 7, numRuns: 80 },
    );
  });

  it("perturbedComparison names the perturbation or phenotype node the model lacks", () => {
    const net = compileDefinition(readRuleText("A' = !B\nB' = !A\n"));
    expect(() => perturbedComparison(net, { C: 0 }, {})).toThrow("perturbation: C is not in this model");
    expect(() => perturbedComparison(net, { A: 0 }, { X: 1, Y: 0 })).toThrow("phenotype: X, Y are not in this model");
    expect(() => perturbedComparison(net, {}, {})).toThrow("perturbation: name at least one node");
  });
});
