import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { networkFromFunctions } from "../network";
import { embeddingCertificate, verifyCertificate } from "../certificates";
import { plantEmulation, randomNetwork, successorsOfNetwork, transitionTable } from "../emulation";
import { embedFunctionalGraph, findDynamicalEmbedding, searchDynamicalEmbedding } from "./index";

/** Slow reference: try every one-to-one map from target states into source states. */
function bruteForceEmbeds(F: ArrayLike<number>, G: ArrayLike<number>): boolean {
  const map = new Array<number>(G.length).fill(-1);
  const used = new Set<number>();
  const place = (x: number): boolean => {
    if (x === G.length) {
      for (let y = 0; y < G.length; y++) if (F[map[y]!] !== map[G[y]!]) return false;
      return true;
    }
    for (let s = 0; s < F.length; s++) {
      if (used.has(s)) continue;
      map[x] = s;
      used.add(s);
      if (place(x + 1)) return true;
      used.delete(s);
    }
    return false;
  };
  return place(0);
}

const randomMap = (rng: () => number, size: number) => Array.from({ length: size }, () => Math.floor(rng() * size));

describe("dynamical embedding", () => {
  it("embedFunctionalGraph agrees with brute force over all one-to-one maps on tiny maps, and its maps are embeddings", () => {
    fc.assert(
      fc.property(
        fc.integer(),
        fc.integer({ min: 1, max: 7 }),
        fc.integer({ min: 1, max: 4 }),
        (seed, fSize, gSize) => {
          const rng = seedrandom(String(seed));
          const F = randomMap(rng, fSize);
          const G = randomMap(rng, gSize);
          const map = embedFunctionalGraph(F, G);
          expect(map !== null).toBe(bruteForceEmbeds(F, G));
          if (map) {
            expect(new Set(map).size).toBe(G.length);
            for (let x = 0; x < G.length; x++) expect(F[map[x]!]).toBe(map[G[x]!]);
          }
        },
      ),
      { seed: 901, numRuns: 400 },
    );
  });

  it("embedFunctionalGraph finds embeddings hidden in larger maps (the target's graph plus random extra states)", () => {
    fc.assert(
      fc.property(
        fc.integer(),
        fc.integer({ min: 1, max: 16 }),
        fc.integer({ min: 0, max: 40 }),
        (seed, gSize, extra) => {
          const rng = seedrandom(String(seed));
          const G = randomMap(rng, gSize);
          // Place G's states at random positions among the source's states; extra states map anywhere.
          const total = gSize + extra;
          const pos = [...Array(total).keys()].sort(() => rng() - 0.5);
          const F = new Array<number>(total);
          for (let s = 0; s < total; s++) F[s] = Math.floor(rng() * total);
          for (let x = 0; x < gSize; x++) F[pos[x]!] = pos[G[x]!]!;
          const map = embedFunctionalGraph(F, G);
          expect(map).not.toBeNull();
          for (let x = 0; x < gSize; x++) expect(F[map![x]!]).toBe(map![G[x]!]);
        },
      ),
      { seed: 902, numRuns: 200 },
    );
  });

  it("findDynamicalEmbedding witnesses pass the certificate verifier, and planted block emulations embed", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 1, max: 3 }), (seed, m) => {
        const rng = seedrandom(String(seed));
        const G = randomNetwork(rng, m, 2, "g");
        const { source } = plantEmulation(rng, G, m * 2 + 4, 2);
        const r = findDynamicalEmbedding(source, G, 1);
        expect(r.found).toBe(true);
        expect(verifyCertificate(embeddingCertificate(source, G, 1, r.map!)).valid).toBe(true);
      }),
      { seed: 903, numRuns: 30 },
    );
  });

  it("searchDynamicalEmbedding finds four fixed points in the 3-node rotation only at t = 3, its period, and never a 2-cycle (common practice)", () => {
    // The 3-node rotation has the fixed points 000 and 111 and two 3-cycles; at t = 3 every state is fixed.
    const names = ["a", "b", "c"];
    const rotation = networkFromFunctions(names, [[2], [0], [1]], (_n, x) => x[0]!);
    const cycle2 = networkFromFunctions(["p"], [[0]], (_n, x) => 1 - x[0]!);
    const r = searchDynamicalEmbedding(rotation, cycle2, 3);
    // Rotation cycles have lengths 1 and 3 (at t=1), 1 and 3 (t=2), 1 (t=3): never a 2-cycle.
    expect(r.found).toBe(false);
    const identity2 = networkFromFunctions(["p", "q"], [[0], [1]], (_n, x) => x[0]!);
    const fixedPoints = searchDynamicalEmbedding(rotation, identity2, 3);
    expect(fixedPoints.found).toBe(true);
    expect(fixedPoints.time).toBe(3); // only 000 and 111 are fixed before t = 3
    const F3 = transitionTable(rotation, 3);
    expect(Array.from(F3)).toEqual([...Array(8).keys()]);
    expect(Array.from(successorsOfNetwork(identity2))).toEqual([0, 1, 2, 3]);
  });

  it("findDynamicalEmbedding embeds every network into itself at t = 1 (common practice)", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 1, max: 8 }), (seed, n) => {
        const F = randomNetwork(seedrandom(String(seed)), n, 3);
        const r = findDynamicalEmbedding(F, F, 1);
        expect(r.found).toBe(true);
        expect(verifyCertificate(embeddingCertificate(F, F, 1, r.map!)).valid).toBe(true);
      }),
      { seed: 904, numRuns: 40 },
    );
  });

  it("searchDynamicalEmbedding reports progress up to 1 and stops with CANCELLED when asked", () => {
    const F = randomNetwork(seedrandom("905"), 8, 2);
    const fractions: number[] = [];
    searchDynamicalEmbedding(F, F, 1, { onProgress: (f) => fractions.push(f) });
    expect(fractions.at(-1)).toBe(1);
    expect(() => searchDynamicalEmbedding(F, F, 2, { shouldStop: () => true })).toThrow(/cancelled/);
  });
});
