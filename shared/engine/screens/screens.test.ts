import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CancelledError } from "../errors";
import { sameAssignment } from "../expectations";
import { networkFromFunctions, type BooleanNetwork } from "../network";
import { perturbNetwork } from "../perturbation";
import { analyseSynchronous } from "../state-graph";
import { randomNK, slowSuccessor, text } from "../update/random-networks.test-support";
import {
  mergeScreenShards,
  runScreen,
  screenRange,
  screenUnit,
  screenUnitCount,
  screenUnits,
  type ScreenRow,
  type ScreenShard,
  type ScreenSpec,
} from "./index";

const names = (n: number) => Array.from({ length: n }, (_, i) => `g${i}`);

/** Brute force: follow every state under the perturbed successor (one state at a time) to its cycle. */
function referenceRow(net: BooleanNetwork, held: Record<number, 0 | 1>, phenotype: Record<number, 0 | 1>) {
  const n = net.names.length;
  const step = (s: number) => {
    let t = slowSuccessor(net, s);
    for (const [node, v] of Object.entries(held)) t = v ? t | (1 << Number(node)) : t & ~(1 << Number(node));
    return t;
  };
  const cycles = new Map<string, number[]>();
  let phenotypeStates = 0;
  for (let s = 0; s < 2 ** n; s++) {
    const path: number[] = [];
    let x = s;
    while (!path.includes(x)) {
      path.push(x);
      x = step(x);
    }
    const cycle = path.slice(path.indexOf(x)).sort((a, b) => a - b);
    cycles.set(cycle.join(","), cycle);
    const has = Object.entries(phenotype).every(([node, v]) =>
      cycle.every((c) => text(c, n)[Number(node)] === String(v)),
    );
    if (has) phenotypeStates++;
  }
  return { share: phenotypeStates / 2 ** n, cycles: new Set(cycles.keys()) };
}

function naiveRow(net: BooleanNetwork, row: ScreenRow, phenotype: Record<string, 0 | 1>) {
  const index = (name: string) => net.names.indexOf(name);
  const entries = Object.entries(row.perturbation);
  const a = analyseSynchronous(
    perturbNetwork(net, {
      knockOut: entries.filter(([, v]) => v === 0).map(([x]) => index(x)),
      overExpress: entries.filter(([, v]) => v === 1).map(([x]) => index(x)),
    }),
  );
  const n = net.names.length;
  let share = 0;
  for (const att of a.attractors) {
    const states = Array.from(att.states, (s) => text(s, n));
    if (Object.entries(phenotype).every(([x, v]) => states.every((s) => s[index(x)] === String(v)))) share += att.basin;
  }
  return { basinShare: share / a.stateCount, attractorsAfter: a.attractors.length };
}

const caseArb = fc
  .record({
    n: fc.integer({ min: 2, max: 8 }),
    k: fc.integer({ min: 1, max: 3 }),
    seed: fc.integer(),
    pairs: fc.boolean(),
  })
  .chain((c) =>
    fc.record({
      c: fc.constant(c),
      nodes: fc.shuffledSubarray(names(c.n), { minLength: 1 }),
      phenotype: fc
        .uniqueArray(fc.tuple(fc.constantFrom(...names(c.n)), fc.constantFrom<0 | 1>(0, 1)), {
          selector: ([x]) => x,
          minLength: 1,
          maxLength: 2,
        })
        .map((e) => Object.fromEntries(e)),
    }),
  );

describe("perturbation screens", () => {
  it("screenUnits lists each single knock-out and over-expression, then each pair on two nodes, once", () => {
    for (const m of [1, 2, 3, 6]) {
      const nodes = names(m);
      const listed = screenUnits({ nodes, pairs: true, phenotype: { g0: 1 } }).map((u) =>
        JSON.stringify(u.perturbation),
      );
      const expected: string[] = [];
      for (const a of nodes) for (const v of [0, 1]) expected.push(JSON.stringify({ [a]: v }));
      for (let a = 0; a < m; a++)
        for (let b = a + 1; b < m; b++)
          for (const va of [0, 1])
            for (const vb of [0, 1]) expected.push(JSON.stringify({ [nodes[a]!]: va, [nodes[b]!]: vb }));
      expect(listed).toEqual(expected);
      expect(screenUnitCount({ nodes, pairs: false, phenotype: {} })).toBe(2 * m);
    }
    expect(() => screenUnit({ nodes: ["a"], pairs: false, phenotype: {} }, 2)).toThrow(/not in this screen/);
  });

  it("runScreen gives every single knock-out of a random 10-node network the basin share found by brute force", () => {
    const net = randomNK(10, 2, 1504);
    const phenotype = { g3: 1 as const, g7: 0 as const };
    const result = runScreen(net, { nodes: names(10), pairs: false, phenotype });
    const base = referenceRow(net, {}, { 3: 1, 7: 0 });
    expect(result.baseline.basinShare).toBe(base.share);
    for (let i = 0; i < 10; i++) {
      const row = result.rows.find((r) => sameAssignment(r.perturbation, { [`g${i}`]: 0 }))!;
      const ref = referenceRow(net, { [i]: 0 }, { 3: 1, 7: 0 });
      expect(row.basinShare).toBe(ref.share);
      expect(row.attractorsAfter).toBe(ref.cycles.size);
      const kept = [...ref.cycles].filter((c) => base.cycles.has(c)).length;
      expect([row.attractorsLost, row.attractorsGained]).toEqual([base.cycles.size - kept, ref.cycles.size - kept]);
    }
    const shares = result.rows.map((r) => r.basinShare!);
    expect(shares).toEqual([...shares].sort((a, b) => b - a));
  });

  it("runScreen equals a separate analysis of each perturbed network, with shares in [0, 1]", () => {
    fc.assert(
      fc.property(caseArb, ({ c, nodes, phenotype }) => {
        const net = randomNK(c.n, c.k, c.seed);
        const result = runScreen(net, { nodes, pairs: c.pairs, phenotype });
        expect(result.rows).toHaveLength(screenUnitCount({ nodes, pairs: c.pairs, phenotype }));
        for (const row of result.rows) {
          expect(row.basinShare).toBeGreaterThanOrEqual(0);
          expect(row.basinShare).toBeLessThanOrEqual(1);
          const naive = naiveRow(net, row, phenotype);
          expect(row.basinShare).toBeCloseTo(naive.basinShare, 12);
          expect(row.attractorsAfter).toBe(naive.attractorsAfter);
          expect(row.basinShareChange).toBeCloseTo(row.basinShare! - result.baseline.basinShare!, 12);
        }
      }),
      { seed: 1505, numRuns: 80 },
    );
  });

  it("mergeScreenShards of any split into ranges, in any order, equals the unsplit screen", () => {
    fc.assert(
      fc.property(
        caseArb,
        fc.array(fc.nat(), { maxLength: 5 }),
        fc.integer(),
        ({ c, nodes, phenotype }, cuts, shuffle) => {
          const net = randomNK(c.n, c.k, c.seed);
          const spec: ScreenSpec = { nodes, pairs: c.pairs, phenotype };
          const total = screenUnitCount(spec);
          const bounds = [...new Set([0, total, ...cuts.map((x) => x % (total + 1))])].sort((a, b) => a - b);
          const shards: ScreenShard[] = [];
          for (let q = 0; q + 1 < bounds.length; q++)
            shards.push(screenRange(net, spec, { start: bounds[q]!, end: bounds[q + 1]! }));
          if (shuffle & 1) shards.reverse();
          expect(mergeScreenShards(shards)).toEqual(runScreen(net, spec));
        },
      ),
      { seed: 1506, numRuns: 60 },
    );
  });

  it("mergeScreenShards refuses shards that leave units out or cover them twice", () => {
    const net = randomNK(5, 2, 3);
    const spec: ScreenSpec = { nodes: ["g0", "g1"], pairs: false, phenotype: { g2: 1 } };
    const a = screenRange(net, spec, { start: 0, end: 2 });
    const b = screenRange(net, spec, { start: 1, end: 4 });
    const c = screenRange(net, spec, { start: 3, end: 4 });
    expect(() => mergeScreenShards([a, c])).toThrow(/units 2..2 are missing/);
    expect(() => mergeScreenShards([a, b])).toThrow(/covered twice/);
    expect(() => mergeScreenShards([])).toThrow(/no shards/);
    expect(() => screenRange(net, spec, { start: 3, end: 9 })).toThrow(/not a range/);
  });

  it("screenRange on a node whose function is already constant changes nothing when it holds that constant", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 8 }), fc.integer(), fc.constantFrom<0 | 1>(0, 1), (n, seed, v) => {
        const random = randomNK(n, 2, seed);
        // Node 0 becomes the constant v; the rest keep their random functions (some read node 0).
        const net: BooleanNetwork = {
          names: random.names,
          regulators: [new Int32Array(0), ...random.regulators.slice(1)],
          tables: [Uint8Array.of(v), ...random.tables.slice(1)],
        };
        const result = runScreen(net, { nodes: ["g0"], pairs: false, phenotype: { g1: 1 } });
        const same = result.rows.find((r) => r.perturbation.g0 === v)!;
        expect(same.basinShare).toBe(result.baseline.basinShare);
        expect([same.attractorsAfter, same.attractorsLost, same.attractorsGained]).toEqual([
          result.baseline.attractors,
          0,
          0,
        ]);
      }),
      { seed: 1507, numRuns: 60 },
    );
  });

  it("runScreen above the exact limit ranks by fixed points with the phenotype and leaves basin shares null", () => {
    fc.assert(
      fc.property(caseArb, ({ c, nodes, phenotype }) => {
        const net = randomNK(c.n, c.k, c.seed);
        const spec: ScreenSpec = { nodes, pairs: false, phenotype };
        const bySat = runScreen(net, { ...spec, exactMaxNodes: 0 });
        expect(bySat).toMatchObject({ method: "sat-fixed-points", counted: "fixed-points" });
        expect(bySat.baseline.basinShare).toBeNull();
        const index = (x: string) => net.names.indexOf(x);
        for (const row of bySat.rows) {
          expect([row.basinShare, row.basinShareChange]).toEqual([null, null]);
          const entries = Object.entries(row.perturbation);
          const exact = analyseSynchronous(
            perturbNetwork(net, {
              knockOut: entries.filter(([, v]) => v === 0).map(([x]) => index(x)),
              overExpress: entries.filter(([, v]) => v === 1).map(([x]) => index(x)),
            }),
          );
          const fixed = exact.attractors.filter((a) => a.length === 1).map((a) => text(a.states[0]!, c.n));
          const carrying = fixed.filter((s) => Object.entries(phenotype).every(([x, v]) => s[index(x)] === String(v)));
          expect([...row.phenotypeFixedPoints!].sort()).toEqual(carrying.sort());
          expect(row.attractorsAfter).toBe(fixed.length);
        }
        const counts = bySat.rows.map((r) => r.phenotypeAttractorsAfter);
        expect(counts).toEqual([...counts].sort((a, b) => b - a));
      }),
      { seed: 1508, numRuns: 30 },
    );
  });

  it("screenRange hands each row to onRow in unit order, reports progress up to 1 and stops on request", () => {
    const net = randomNK(12, 2, 5);
    const spec: ScreenSpec = { nodes: ["g0", "g1", "g2"], pairs: true, phenotype: { g4: 1 } };
    const seen: number[] = [];
    const fractions: number[] = [];
    screenRange(
      net,
      spec,
      { start: 2, end: 9 },
      { onRow: (r) => seen.push(r.unit), onProgress: (f) => fractions.push(f) },
    );
    expect(seen).toEqual([2, 3, 4, 5, 6, 7, 8]);
    expect(fractions.at(-1)).toBe(1);
    expect(fractions.every((f, i) => i === 0 || f >= fractions[i - 1]!)).toBe(true);
    let calls = 0;
    expect(() => screenRange(net, spec, { start: 0, end: 9 }, { shouldStop: () => ++calls > 3 })).toThrow(
      CancelledError,
    );
  });

  it("runScreen refuses an unknown node, a node chosen twice and an empty phenotype", () => {
    const net = networkFromFunctions(["a", "b"], [[1], [0]], (_n, x) => x[0]!);
    expect(() => runScreen(net, { nodes: ["c"], pairs: false, phenotype: { a: 1 } })).toThrow(
      /node c is not in this model/,
    );
    expect(() => runScreen(net, { nodes: ["a", "a"], pairs: false, phenotype: { a: 1 } })).toThrow(/chosen twice/);
    expect(() => runScreen(net, { nodes: ["a"], pairs: false, phenotype: {} })).toThrow(/names no node/);
    expect(() => runScreen(net, { nodes: ["a"], pairs: false, phenotype: { z: 1 } })).toThrow(/phenotype node z/);
  });
});
