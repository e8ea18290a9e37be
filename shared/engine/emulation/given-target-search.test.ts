import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { networkFromFunctions, type BooleanNetwork } from "../network";
import { reorderNodes } from "../network/reorder-nodes.test-support";
import { blockEmulationCertificate, verifyCertificate } from "../certificates";
import {
  mergeEmulationShards,
  plantEmulation,
  randomNetwork,
  searchBlockEmulation,
  successorsOfNetwork,
  witnessHolds,
  type BlockEmulationWitness,
} from "./index";

function randomPermutation(rng: () => number, n: number): number[] {
  const p = [...Array(n).keys()];
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(rng() * (i + 1));
    [p[i], p[j]] = [p[j]!, p[i]!];
  }
  return p;
}

/** Slow reference: every assignment of source nodes to blocks/context, every pair of codewords, every context. */
function bruteForceEmulates(F: BooleanNetwork, G: BooleanNetwork, t: number, maxBlock: number): boolean {
  const n = F.names.length;
  const m = G.names.length;
  const gSucc = successorsOfNetwork(G);
  const owner = new Array<number>(n).fill(-1);
  const tryCodewords = (): boolean => {
    const blocks = Array.from({ length: m }, (_, j) => [...Array(n).keys()].filter((v) => owner[v] === j));
    if (blocks.some((b) => b.length === 0 || b.length > maxBlock)) return false;
    const ctxNodes = [...Array(n).keys()].filter((v) => owner[v] === -1);
    const choices = (j: number, acc: { nodes: number[]; zero: number[]; one: number[] }[]): boolean => {
      if (j === m) {
        for (let c = 0; c < 2 ** ctxNodes.length; c++) {
          const context = new Array<number>(n).fill(-1);
          ctxNodes.forEach((v, i) => (context[v] = (c >> i) & 1));
          const w: BlockEmulationWitness = { time: t, blocks: acc, context };
          if (witnessHolds(F, gSucc, w)) return true;
        }
        return false;
      }
      const b = blocks[j]!;
      for (let z = 0; z < 2 ** b.length; z++) {
        for (let o = 0; o < 2 ** b.length; o++) {
          if (z === o) continue;
          const word = (x: number) => b.map((_, i) => (x >> i) & 1);
          if (choices(j + 1, [...acc, { nodes: b, zero: word(z), one: word(o) }])) return true;
        }
      }
      return false;
    };
    return choices(0, []);
  };
  const assign = (v: number): boolean => {
    if (v === n) return tryCodewords();
    for (let j = -1; j < m; j++) {
      owner[v] = j;
      if (assign(v + 1)) return true;
    }
    owner[v] = -1;
    return false;
  };
  return assign(0);
}

const verifies = (F: BooleanNetwork, G: BooleanNetwork, w: BlockEmulationWitness) =>
  verifyCertificate(blockEmulationCertificate(F, G, w)).valid;

describe("searchBlockEmulation", () => {
  it("searchBlockEmulation finds planted reductions and every witness it returns passes the verifier", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 1, max: 3 }), fc.integer({ min: 0, max: 6 }), (seed, m, extra) => {
        const rng = seedrandom(String(seed));
        const G = randomNetwork(rng, m, 2, "g");
        const { source, witness } = plantEmulation(rng, G, m * 2 + extra, 2);
        expect(witnessHolds(source, successorsOfNetwork(G), witness)).toBe(true);
        for (const method of ["sat", "enumeration"] as const) {
          const r = searchBlockEmulation(source, G, { maxTime: 1, maxBlock: 2, method });
          expect(r.found).toBe(true);
          expect(verifies(source, G, r.witness!)).toBe(true);
        }
      }),
      { seed: 701, numRuns: 40 },
    );
  });

  it("searchBlockEmulation agrees with a brute-force enumeration of all encodings on small sources, by SAT and by enumeration", () => {
    fc.assert(
      fc.property(
        fc.integer(),
        fc.integer({ min: 2, max: 4 }),
        fc.integer({ min: 1, max: 2 }),
        fc.integer({ min: 1, max: 2 }),
        (seed, n, m, t) => {
          const rng = seedrandom(String(seed));
          const F = randomNetwork(rng, n, 2);
          const G = randomNetwork(rng, m, 2, "g");
          const expected = [...Array(t).keys()].map((k) => k + 1).find((k) => bruteForceEmulates(F, G, k, 2)) ?? null;
          for (const method of ["sat", "enumeration"] as const) {
            const r = searchBlockEmulation(F, G, { maxTime: t, maxBlock: 2, method });
            expect(r.found ? r.witness!.time : null).toBe(expected);
            if (r.found) expect(verifies(F, G, r.witness!)).toBe(true);
          }
        },
      ),
      { seed: 702, numRuns: 60 },
    );
  });

  it("searchBlockEmulation gives the same answer after renaming and reordering the source nodes", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 3, max: 7 }), fc.integer({ min: 1, max: 2 }), (seed, n, m) => {
        const rng = seedrandom(String(seed));
        const F =
          rng() < 0.5 ? randomNetwork(rng, n, 2) : plantEmulation(rng, randomNetwork(rng, m, 2, "g"), n, 2).source;
        const G = randomNetwork(rng, m, 2, "g");
        const F2 = reorderNodes(F, randomPermutation(rng, n), "renamed_");
        const a = searchBlockEmulation(F, G, { maxTime: 2, maxBlock: 2 });
        const b = searchBlockEmulation(F2, G, { maxTime: 2, maxBlock: 2 });
        expect(b.found).toBe(a.found);
        if (a.found) expect(b.witness!.time).toBe(a.witness!.time);
        if (b.found) expect(verifies(F2, G, b.witness!)).toBe(true);
      }),
      { seed: 703, numRuns: 40 },
    );
  });

  it("mergeEmulationShards over any split equals the unsplit searchBlockEmulation run (both methods)", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 2, max: 5 }), (seed, count) => {
        const rng = seedrandom(String(seed));
        const G = randomNetwork(rng, 2, 2, "g");
        const F = rng() < 0.5 ? plantEmulation(rng, G, 7, 2).source : randomNetwork(rng, 6, 2);
        const bounds = { maxTime: 2, maxBlock: 2, method: rng() < 0.5 ? ("sat" as const) : ("enumeration" as const) };
        const whole = searchBlockEmulation(F, G, bounds);
        const parts = [...Array(count).keys()].map((index) =>
          searchBlockEmulation(F, G, bounds, { shard: { index, count } }),
        );
        const merged = mergeEmulationShards(parts.reverse());
        expect({ ...merged, satQueries: 0 }).toEqual({ ...whole, satQueries: 0 });
      }),
      { seed: 704, numRuns: 25 },
    );
  });

  it("searchBlockEmulation resumed from a reported cursor reaches the same result", () => {
    const rng = seedrandom("705");
    const G = randomNetwork(rng, 2, 2, "g");
    const F = plantEmulation(rng, G, 9, 2).source;
    const bounds = { maxTime: 2, maxBlock: 2 };
    const whole = searchBlockEmulation(F, G, bounds);
    const cursors: number[] = [];
    searchBlockEmulation(F, G, bounds, { onCursor: (c) => cursors.push(c) });
    for (const c of cursors) {
      if (whole.unit !== null && c > whole.unit) continue;
      const resumed = searchBlockEmulation(F, G, bounds, { resumeFrom: c });
      expect(resumed.witness).toEqual(whole.witness);
    }
  });

  it("searchBlockEmulation stops with CANCELLED when shouldStop answers true", () => {
    const rng = seedrandom("706");
    const G = randomNetwork(rng, 2, 2, "g");
    const F = randomNetwork(rng, 8, 2);
    expect(() => searchBlockEmulation(F, G, { maxTime: 2, maxBlock: 2 }, { shouldStop: () => true })).toThrow(
      /cancelled/,
    );
  });

  it("searchBlockEmulation shows that a network emulates itself at t = 1 with blocks of one node (common practice)", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 1, max: 7 }), (seed, n) => {
        const F = randomNetwork(seedrandom(String(seed)), n, 3);
        const r = searchBlockEmulation(F, F, { maxTime: 1, maxBlock: 1, contextAllowed: false });
        expect(r.found).toBe(true);
        if (n <= 4)
          expect(
            searchBlockEmulation(F, F, { maxTime: 1, maxBlock: 1, contextAllowed: false, method: "enumeration" }).found,
          ).toBe(true);
        const identity: BlockEmulationWitness = {
          time: 1,
          blocks: F.names.map((_, v) => ({ nodes: [v], zero: [0], one: [1] })),
          context: F.names.map(() => -1),
        };
        expect(verifies(F, F, identity)).toBe(true);
      }),
      { seed: 707, numRuns: 30 },
    );
  });

  it("searchBlockEmulation finds the rotation of k nodes emulating the identity only at t = k, its period (common practice)", () => {
    for (const k of [2, 3, 4]) {
      const names = Array.from({ length: k }, (_, i) => `r${i}`);
      const rotation = networkFromFunctions(
        names,
        names.map((_, i) => [(i + k - 1) % k]),
        (_node, x) => x[0]!,
      );
      const identity = networkFromFunctions(
        names,
        names.map((_, i) => [i]),
        (_node, x) => x[0]!,
      );
      const r = searchBlockEmulation(rotation, identity, { maxTime: k, maxBlock: 1, contextAllowed: false });
      expect(r.found).toBe(true);
      expect(r.witness!.time).toBe(k);
      expect(verifies(rotation, identity, r.witness!)).toBe(true);
    }
  });

  it("searchBlockEmulation keeps disallowed nodes in the context and reports none when they are needed", () => {
    const G = networkFromFunctions(["g"], [[0]], (_n, x) => 1 - x[0]!);
    // a' = !a, b' = b: only a can carry the oscillating target node.
    const F = networkFromFunctions(["a", "b"], [[0], [1]], (node, x) => (node === 0 ? 1 - x[0]! : x[0]!));
    expect(searchBlockEmulation(F, G, { maxTime: 1, maxBlock: 2, allowedNodes: [0] }).found).toBe(true);
    const onlyB = searchBlockEmulation(F, G, { maxTime: 3, maxBlock: 2, allowedNodes: [1] });
    expect(onlyB.found).toBe(false);
    expect(onlyB.bounds).toEqual({ maxTime: 3, maxBlock: 2, contextAllowed: true, allowedNodes: [1], method: "sat" });
    expect(
      searchBlockEmulation(F, G, { maxTime: 3, maxBlock: 2, allowedNodes: [1], method: "enumeration" }).found,
    ).toBe(false);
    expect(
      searchBlockEmulation(F, G, { maxTime: 1, maxBlock: 2, allowedNodes: [0], method: "enumeration" }).found,
    ).toBe(true);
  });
});
