import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { networkFromFunctions, type BooleanNetwork } from "../network";
import { reorderNodes } from "../network/reorder-nodes.test-support";
import { blockEmulationCertificate, verifyCertificate } from "../certificates";
import {
  canonicalTargetKey,
  discoverEmulatedTargets,
  interactionCount,
  discoverShard,
  mergeDiscoverShards,
  plantEmulation,
  randomNetwork,
  successorsOfNetwork,
  transitionTable,
  trivialityFlags,
  type DiscoveredTarget,
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

/**
 * Slow reference for the whole discover result on tiny sources. Whatever the codewords and context, the encoded set
 * of an encoding is s0 xor the unions of its blocks' difference masks (disjoint, non-empty, at most maxBlock nodes),
 * so listing every base state and every set of masks lists every encoded set; each one counts once, with its
 * smallest state as base. The representative of a target is its first encoding in the documented order: time
 * scale, then base state, then the masks' node lists compared lexicographically (a prefix first).
 */
function referenceDiscover(
  F: BooleanNetwork,
  bounds: { maxTargetNodes: number; maxTime: number; maxBlock: number; contextAllowed: boolean },
) {
  const n = F.names.length;
  const nodesOf = (mask: number) => [...Array(n).keys()].filter((v) => (mask >> v) & 1);
  const subsets: number[] = [];
  for (let mask = 1; mask < 2 ** n; mask++) if (nodesOf(mask).length <= bounds.maxBlock) subsets.push(mask);
  const lowest = (mask: number) => nodesOf(mask)[0]!;
  // Sets of masks listed with their masks by increasing smallest node, so target node k is carried by mask k.
  const maskSets: number[][] = [];
  const grow = (chosen: number[], union: number) => {
    if (chosen.length > 0) maskSets.push(chosen);
    if (chosen.length === bounds.maxTargetNodes) return;
    for (const s of subsets)
      if ((s & union) === 0 && (chosen.length === 0 || lowest(s) > lowest(chosen[chosen.length - 1]!)))
        grow([...chosen, s], union | s);
  };
  grow([], 0);
  const lexBlocks = (a: number[], b: number[]) => {
    for (let k = 0; k < Math.min(a.length, b.length); k++) {
      const p = nodesOf(a[k]!);
      const q = nodesOf(b[k]!);
      for (let i = 0; i < Math.min(p.length, q.length); i++) if (p[i] !== q[i]) return p[i]! - q[i]!;
      if (p.length !== q.length) return p.length - q.length;
    }
    return a.length - b.length;
  };
  const found = new Map<
    string,
    { succ: number[]; t: number; s0: number; masks: number[]; times: Set<number>; encodings: number }
  >();
  for (let t = 1; t <= bounds.maxTime; t++) {
    const Ft = transitionTable(F, t);
    for (let s0 = 0; s0 < 2 ** n; s0++) {
      for (const masks of maskSets) {
        const m = masks.length;
        const union = masks.reduce((u, q) => u | q, 0);
        const spare = masks.reduce((s, q) => s + bounds.maxBlock - nodesOf(q).length, 0);
        if (!bounds.contextAllowed && n - nodesOf(union).length > spare) continue;
        const enc = (x: number) => masks.reduce((s, q, k) => ((x >> k) & 1 ? s ^ q : s), s0);
        const states = Array.from({ length: 2 ** m }, (_, x) => enc(x));
        if (Math.min(...states) !== s0) continue;
        const succ = states.map((s) => states.indexOf(Ft[s]!));
        if (succ.includes(-1)) continue;
        const key = canonicalTargetKey(succ, m);
        const entry = found.get(key);
        if (!entry) found.set(key, { succ, t, s0, masks, times: new Set([t]), encodings: 1 });
        else {
          entry.encodings++;
          entry.times.add(t);
          const later =
            entry.t !== t ? entry.t < t : entry.s0 !== s0 ? entry.s0 < s0 : lexBlocks(entry.masks, masks) < 0;
          if (!later) Object.assign(entry, { succ, t, s0, masks });
        }
      }
    }
  }
  return [...found.entries()].map(([key, e]) => ({ key, ...e, times: [...e.times].sort((a, b) => a - b) }));
}

/** The documented ranking: non-trivial first, more nodes, more interactions, smaller time, fewer block nodes, key. */
function documentedOrder(a: DiscoveredTarget, b: DiscoveredTarget): number {
  const blockNodes = (d: DiscoveredTarget) => d.witness.blocks.reduce((s, q) => s + q.nodes.length, 0);
  return (
    Number(a.trivial) - Number(b.trivial) ||
    b.target.names.length - a.target.names.length ||
    b.interactions - a.interactions ||
    a.times[0]! - b.times[0]! ||
    blockNodes(a) - blockNodes(b) ||
    (a.key < b.key ? -1 : 1)
  );
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

  it("discoverEmulatedTargets reports exactly the reference's targets, times, counts, representatives and ranking on sources of up to 6 nodes", () => {
    fc.assert(
      fc.property(
        fc.integer(),
        fc.integer({ min: 1, max: 6 }),
        fc.record({
          maxTargetNodes: fc.integer({ min: 1, max: 4 }),
          maxTime: fc.integer({ min: 1, max: 4 }),
          maxBlock: fc.integer({ min: 1, max: 3 }),
          contextAllowed: fc.boolean(),
        }),
        fc.integer({ min: 1, max: 3 }),
        (seed, n, bounds, maxInputs) => {
          const F = randomNetwork(seedrandom(String(seed)), n, maxInputs);
          const found = discoverEmulatedTargets(F, bounds);
          const reference = referenceDiscover(F, bounds);
          expect(found.targets.map((d) => d.key).sort()).toEqual(reference.map((r) => r.key).sort());
          const size = 2 ** n;
          for (const d of found.targets) {
            const r = reference.find((x) => x.key === d.key)!;
            const m = r.masks.length;
            expect({ times: d.times, encodings: d.encodings, firstUnit: d.firstUnit }).toEqual({
              times: r.times,
              encodings: r.encodings,
              firstUnit: (r.t - 1) * size + r.s0,
            });
            expect(Array.from(successorsOfNetwork(d.target))).toEqual(r.succ);
            expect(d.flags).toEqual(trivialityFlags(r.succ, m));
            expect(d.trivial).toBe(d.flags.length > 0);
            expect(d.interactions).toBe(interactionCount(r.succ, m));
            expect(d.witness.time).toBe(r.t);
            d.witness.blocks.forEach((b, k) => {
              const own = b.nodes.filter((v, i) => b.zero[i] !== b.one[i]);
              expect(own.reduce((q, v) => q | (1 << v), 0)).toBe(r.masks[k]);
              b.nodes.forEach((v, i) => expect(b.zero[i]).toBe((r.s0 >> v) & 1));
            });
            if (bounds.contextAllowed)
              expect(d.witness.blocks.map((b) => b.nodes.length)).toEqual(
                r.masks.map((q) => q.toString(2).replace(/0/g, "").length),
              );
            expect(verifyCertificate(blockEmulationCertificate(F, d.target, d.witness)).valid).toBe(true);
          }
          expect(found.targets).toEqual([...found.targets].sort(documentedOrder));
        },
      ),
      { seed: 808, numRuns: 60 },
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
