import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { networkFromFunctions, type BooleanNetwork } from "../network";
import { reorderNodes } from "../network/reorder-nodes.test-support";
import { blockEmulationCertificate, verifyCertificate } from "../certificates";
import {
  canonicalTargetKey,
  discoverEmulatedTargets,
  discoverShard,
  mergeDiscoverShards,
  plantEmulation,
  randomNetwork,
  successorsOfNetwork,
  transitionTable,
  trivialityFlags,
} from "./index";

/** Slow reference: canonical keys of all targets of 1..M nodes reachable by any encoding (any codewords, any context). */
function bruteForceKeys(F: BooleanNetwork, M: number, maxTime: number, maxBlock: number): Set<string> {
  const n = F.names.length;
  const keys = new Set<string>();
  for (let t = 1; t <= maxTime; t++) {
    const Ft = transitionTable(F, t);
    for (let m = 1; m <= M; m++) {
      // owner[v] in -1..m-1, then codeword pairs per block, then context.
      const owner = new Array<number>(n).fill(-1);
      const visitOwners = (v: number) => {
        if (v === n) {
          const blocks = Array.from({ length: m }, (_, j) => [...Array(n).keys()].filter((u) => owner[u] === j));
          if (blocks.some((b) => b.length === 0 || b.length > maxBlock)) return;
          const ctx = [...Array(n).keys()].filter((u) => owner[u] === -1);
          const words: [number, number][][] = blocks.map((b) => {
            const out: [number, number][] = [];
            for (let z = 0; z < 2 ** b.length; z++)
              for (let o = 0; o < 2 ** b.length; o++) if (z !== o) out.push([z, o]);
            return out;
          });
          const pickWords = (j: number, chosen: [number, number][]) => {
            if (j === m) {
              for (let c = 0; c < 2 ** ctx.length; c++) {
                const enc = (x: number) => {
                  let s = 0;
                  ctx.forEach((u, i) => (s |= ((c >> i) & 1) << u));
                  blocks.forEach((b, k) => {
                    const word = chosen[k]![(x >> k) & 1]!;
                    b.forEach((u, i) => (s |= ((word >> i) & 1) << u));
                  });
                  return s;
                };
                const index = new Map<number, number>();
                for (let x = 0; x < 2 ** m; x++) index.set(enc(x), x);
                const succ: number[] = [];
                let closed = true;
                for (let x = 0; x < 2 ** m && closed; x++) {
                  const y = index.get(Ft[enc(x)]!);
                  if (y === undefined) closed = false;
                  else succ.push(y);
                }
                if (closed) keys.add(canonicalTargetKey(succ, m));
              }
              return;
            }
            for (const w of words[j]!) pickWords(j + 1, [...chosen, w]);
          };
          pickWords(0, []);
          return;
        }
        for (let j = -1; j < m; j++) {
          owner[v] = j;
          visitOwners(v + 1);
        }
      };
      visitOwners(0);
    }
  }
  return keys;
}

describe("discoverEmulatedTargets", () => {
  it("discoverEmulatedTargets finds exactly the targets of a brute-force enumeration of encodings on tiny sources", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 2, max: 4 }), fc.integer({ min: 1, max: 2 }), (seed, n, maxTime) => {
        const F = randomNetwork(seedrandom(String(seed)), n, 2);
        const found = discoverEmulatedTargets(F, { maxTargetNodes: 2, maxTime, maxBlock: 2 });
        expect(new Set(found.targets.map((d) => d.key))).toEqual(bruteForceKeys(F, 2, maxTime, 2));
      }),
      { seed: 801, numRuns: 30 },
    );
  });

  it("discoverEmulatedTargets returns witnesses that the verifier accepts and finds a planted target", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 1, max: 3 }), (seed, m) => {
        const rng = seedrandom(String(seed));
        const G = randomNetwork(rng, m, 2, "g");
        const { source } = plantEmulation(rng, G, m + 3, 1);
        const found = discoverEmulatedTargets(source, { maxTargetNodes: m, maxTime: 1, maxBlock: 1 });
        expect(found.targets.map((d) => d.key)).toContain(canonicalTargetKey(successorsOfNetwork(G), m));
        for (const d of found.targets) {
          expect(verifyCertificate(blockEmulationCertificate(source, d.target, d.witness)).valid).toBe(true);
          expect(d.times[0]).toBe(d.witness.time);
        }
      }),
      { seed: 802, numRuns: 25 },
    );
  });

  it("mergeDiscoverShards over any split equals the unsplit discoverEmulatedTargets run", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 2, max: 6 }), (seed, count) => {
        const F = randomNetwork(seedrandom(String(seed)), 6, 2);
        const bounds = { maxTargetNodes: 3, maxTime: 2, maxBlock: 2 };
        const whole = discoverEmulatedTargets(F, bounds);
        const merged = mergeDiscoverShards(
          [...Array(count).keys()].map((index) => discoverShard(F, bounds, { shard: { index, count } })).reverse(),
        );
        expect(merged).toEqual(whole);
      }),
      { seed: 803, numRuns: 15 },
    );
  });

  it("discoverEmulatedTargets ranks non-trivial targets first and flags the identity, constant and decoupled ones", () => {
    // a' = b, b' = a: swaps two nodes (interaction); c' = c (identity on one node).
    const F = networkFromFunctions(["a", "b", "c"], [[1], [0], [2]], (_node, x) => x[0]!);
    const found = discoverEmulatedTargets(F, { maxTargetNodes: 2, maxTime: 1, maxBlock: 1 });
    const firstTrivial = found.targets.findIndex((d) => d.trivial);
    expect(found.targets.slice(firstTrivial).every((d) => d.trivial)).toBe(true);
    expect(found.targets[0]!.trivial).toBe(false);
    expect(found.targets[0]!.key).toBe(canonicalTargetKey([0, 2, 1, 3], 2));
    expect(trivialityFlags([0, 1, 2, 3], 2)).toEqual(["identity", "decoupled"]);
    expect(trivialityFlags([3, 3, 3, 3], 2)).toEqual(["constant", "decoupled"]);
    expect(trivialityFlags([1, 0, 3, 2], 2)).toEqual(["decoupled"]);
  });

  it("canonicalTargetKey is unchanged by renaming target nodes and swapping codewords", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 1, max: 4 }), (seed, m) => {
        const rng = seedrandom(String(seed));
        const succ = Array.from({ length: 2 ** m }, () => Math.floor(rng() * 2 ** m));
        const perm = [...Array(m).keys()].sort(() => rng() - 0.5);
        const flip = Math.floor(rng() * 2 ** m);
        const T = (x: number) => perm.reduce((y, to, from) => y | (((x >> from) & 1) << to), 0) ^ flip;
        const moved = new Array<number>(2 ** m);
        for (let x = 0; x < 2 ** m; x++) moved[T(x)] = T(succ[x]!);
        expect(canonicalTargetKey(moved, m)).toBe(canonicalTargetKey(succ, m));
      }),
      { seed: 804, numRuns: 100 },
    );
  });

  it("discoverEmulatedTargets finds the same targets after renaming and reordering the source nodes", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 2, max: 7 }), (seed, n) => {
        const rng = seedrandom(String(seed));
        const F = randomNetwork(rng, n, 2);
        const F2 = reorderNodes(
          F,
          [...Array(n).keys()].sort(() => rng() - 0.5),
          "r",
        );
        const bounds = { maxTargetNodes: 3, maxTime: 2, maxBlock: 2 };
        const keys = (net: BooleanNetwork) =>
          discoverEmulatedTargets(net, bounds)
            .targets.map((d) => `${d.key}@${d.times.join(",")}x${d.encodings}`)
            .sort();
        expect(keys(F2)).toEqual(keys(F));
      }),
      { seed: 805, numRuns: 30 },
    );
  });

  it("discoverEmulatedTargets by SAT finds the same targets and time scales as by enumeration, with verified witnesses", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 2, max: 6 }), fc.boolean(), (seed, n, contextAllowed) => {
        const F = randomNetwork(seedrandom(String(seed)), n, 2);
        const bounds = { maxTargetNodes: 3, maxTime: 2, maxBlock: 2, contextAllowed };
        const byEnumeration = discoverEmulatedTargets(F, { ...bounds, method: "enumeration" });
        const bySat = discoverEmulatedTargets(F, { ...bounds, method: "sat" });
        const keys = (r: typeof bySat) => r.targets.map((d) => `${d.key}@${d.times.join(",")}`).sort();
        expect(keys(bySat)).toEqual(keys(byEnumeration));
        for (const d of bySat.targets)
          expect(verifyCertificate(blockEmulationCertificate(F, d.target, d.witness)).valid).toBe(true);
      }),
      { seed: 806, numRuns: 25 },
    );
  });

  it("mergeDiscoverShards over any split equals the unsplit SAT discover run", () => {
    const F = randomNetwork(seedrandom("807"), 7, 2);
    const bounds = { maxTargetNodes: 3, maxTime: 2, maxBlock: 2, method: "sat" as const };
    const whole = discoverEmulatedTargets(F, bounds);
    for (const count of [2, 3, 6]) {
      const merged = mergeDiscoverShards(
        [...Array(count).keys()].map((index) => discoverShard(F, bounds, { shard: { index, count } })),
      );
      expect(merged).toEqual(whole);
    }
  });
});
