import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { checkNetwork, type BooleanNetwork } from "../network";
import { coarseGrainingCertificate, verifyCertificate } from "../certificates";
import { randomNetwork, successorsOfNetwork, transitionTable } from "../emulation";
import { cellularAutomaton } from "../generators";
import { reorderNodes } from "../network/reorder-nodes.test-support";
import { coarseGrain, coarseGrainsOnto, coarsestCompatiblePartition, nodeObservable, observeAll } from "./index";

/** Every set partition of 0..N-1 as a restricted growth string. */
function* setPartitions(N: number): Generator<number[]> {
  const a = new Array<number>(N).fill(0);
  const rec = function* (i: number, max: number): Generator<number[]> {
    if (i === N) {
      yield [...a];
      return;
    }
    for (let g = 0; g <= max + 1; g++) {
      a[i] = g;
      yield* rec(i + 1, Math.max(max, g));
    }
  };
  if (N > 0) yield* rec(1, 0);
}

const sameGroups = (a: ArrayLike<unknown>, b: ArrayLike<unknown>) => {
  for (let x = 0; x < a.length; x++)
    for (let y = 0; y < a.length; y++) if ((a[x] === a[y]) !== (b[x] === b[y])) return false;
  return true;
};

/** A source whose first m nodes form the network G (reading only each other) plus noise nodes reading anything. */
function withNoise(rng: () => number, G: BooleanNetwork, extra: number): BooleanNetwork {
  const noise = randomNetwork(rng, G.names.length + extra, 2);
  return checkNetwork({
    names: [...G.names, ...noise.names.slice(G.names.length)],
    regulators: [...G.regulators, ...noise.regulators.slice(G.names.length)],
    tables: [...G.tables, ...noise.tables.slice(G.names.length)],
  });
}

describe("coarse-graining", () => {
  it("coarsestCompatiblePartition is the coarsest refinement compatible with the map (brute force over all partitions)", () => {
    fc.assert(
      fc.property(
        fc.integer(),
        fc.integer({ min: 1, max: 7 }),
        fc.integer({ min: 1, max: 3 }),
        (seed, N, labelCount) => {
          const rng = seedrandom(String(seed));
          const succ = Array.from({ length: N }, () => Math.floor(rng() * N));
          const labels = Array.from({ length: N }, () => Math.floor(rng() * labelCount));
          const ours = coarsestCompatiblePartition(succ, labels);
          let best: number[] | null = null;
          for (const p of setPartitions(N)) {
            let ok = true;
            for (let x = 0; x < N && ok; x++) {
              for (let y = 0; y < N && ok; y++) {
                if (p[x] !== p[y]) continue;
                if (labels[x] !== labels[y] || p[succ[x]!] !== p[succ[y]!]) ok = false;
              }
            }
            if (!ok) continue;
            // Every compatible refinement of the labels refines the coarsest one.
            for (let x = 0; x < N; x++)
              for (let y = 0; y < N; y++) if (p[x] === p[y]) expect(ours.groupOf[x]).toBe(ours.groupOf[y]);
            if (!best || Math.max(...p) < Math.max(...best)) best = p;
          }
          expect(ours.groups).toBe(Math.max(...best!) + 1);
          expect(sameGroups(ours.groupOf, best!)).toBe(true);
        },
      ),
      { seed: 1001, numRuns: 150 },
    );
  });

  it("coarseGrain groups two states together exactly when their observable sequences agree along the orbit", () => {
    fc.assert(
      fc.property(
        fc.integer(),
        fc.integer({ min: 2, max: 9 }),
        fc.integer({ min: 1, max: 3 }),
        fc.integer({ min: 1, max: 3 }),
        (seed, n, k, t) => {
          const F = randomNetwork(seedrandom(String(seed)), n, 3);
          const obs = [...Array(Math.min(k, n)).keys()].map((v) => nodeObservable(F, v));
          const r = coarseGrain(F, obs, t);
          const Ft = transitionTable(F, t);
          const labels = observeAll(n, obs);
          const word = (x: number) => {
            const out: number[] = [];
            for (let i = 0, s = x; i <= Ft.length; i++, s = Ft[s]!) out.push(labels[s]!);
            return out.join(",");
          };
          const words = Array.from({ length: Ft.length }, (_, x) => word(x));
          expect(sameGroups(r.groupOf, words)).toBe(true);
          for (let x = 0; x < Ft.length; x++) {
            expect(r.groupSucc[r.groupOf[x]!]).toBe(r.groupOf[Ft[x]!]);
            expect(r.groupLabel[r.groupOf[x]!]).toBe(labels[x]);
          }
          const q = successorsOfNetwork(r.quotient);
          for (let g = 0; g < r.groups; g++) expect(q[g]).toBe(r.groupSucc[g]);
        },
      ),
      { seed: 1002, numRuns: 80 },
    );
  });

  it("coarseGrain closes on the nodes of an embedded subnetwork, recovers it and yields a certificate the verifier accepts", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 1, max: 4 }), fc.integer({ min: 0, max: 5 }), (seed, m, extra) => {
        const rng = seedrandom(String(seed));
        const G = randomNetwork(rng, m, 2, "g");
        const F = withNoise(rng, G, extra);
        const obs = G.names.map((_, v) => nodeObservable(F, v));
        const r = coarseGrain(F, obs, 1);
        expect(r.closes).toBe(true);
        expect(Array.from(successorsOfNetwork(r.target!))).toEqual(Array.from(successorsOfNetwork(G)));
        expect(coarseGrainsOnto(F, G, obs, 1)).toBe(true);
        expect(verifyCertificate(coarseGrainingCertificate(F, G, 1, obs)).valid).toBe(true);
      }),
      { seed: 1003, numRuns: 60 },
    );
  });

  it("coarseGrain gives the same group count after reordering the source nodes", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 2, max: 8 }), (seed, n) => {
        const rng = seedrandom(String(seed));
        const F = randomNetwork(rng, n, 3);
        const perm = [...Array(n).keys()].sort(() => rng() - 0.5);
        const F2 = reorderNodes(F, perm, "r");
        const a = coarseGrain(F, [nodeObservable(F, 0)], 1);
        const b = coarseGrain(F2, [nodeObservable(F2, perm.indexOf(0))], 1);
        expect(b.groups).toBe(a.groups);
        expect(b.closes).toBe(a.closes);
      }),
      { seed: 1004, numRuns: 60 },
    );
  });

  it("coarseGrain of a 2-node swap observed on one node needs both nodes, and the quotient is a 2-node network", () => {
    // a' = b, b' = a: observing a alone does not close (a's next value is b), so 4 groups are needed.
    const F = checkNetwork({
      names: ["a", "b"],
      regulators: [Int32Array.of(1), Int32Array.of(0)],
      tables: [Uint8Array.of(0, 1), Uint8Array.of(0, 1)],
    });
    const r = coarseGrain(F, [nodeObservable(F, 0)], 1);
    expect(r.closes).toBe(false);
    expect(r.groups).toBe(4);
    expect(r.quotient.names).toEqual(["q0", "q1"]);
    // At t = 2 the swap is the identity, so observing a closes onto the one-node identity.
    const r2 = coarseGrain(F, [nodeObservable(F, 0)], 2);
    expect(r2.closes).toBe(true);
    expect(Array.from(successorsOfNetwork(r2.target!))).toEqual([0, 1]);
  });

  it("coarseGrain reports progress up to 1 and stops with CANCELLED when asked", () => {
    const F = randomNetwork(seedrandom("1005"), 8, 2);
    const fractions: number[] = [];
    coarseGrain(F, [nodeObservable(F, 0)], 1, { onProgress: (f) => fractions.push(f) });
    expect(fractions.at(-1)).toBe(1);
    expect(() => coarseGrain(F, [nodeObservable(F, 0)], 1, { shouldStop: () => true })).toThrow(/cancelled/);
  });

  it("coarseGrain reproduces published coarse-grainings of elementary automata: rule 146 onto rule 128 and rule 105 onto rule 150", () => {
    // Israeli, Goldenfeld, "Computational irreducibility and the predictability of complex physical systems",
    // Physical Review Letters 92, 074105 (2004): rule 146 with 3-cell supercells, 3 steps and the projection
    // "111 -> 1, otherwise 0" gives rule 128; rule 105 with 2-cell supercells and 2 steps gives rule 150
    // (values from memory).
    const cases = [
      { rule: 146, k: 3, time: 3, table: [0, 0, 0, 0, 0, 0, 0, 1], target: 128 },
      { rule: 105, k: 2, time: 2, table: [0, 1, 1, 0], target: 150 },
    ];
    for (const c of cases) {
      for (const N of [3, 4]) {
        const F = cellularAutomaton({ cells: N * c.k, rule: c.rule });
        const G = cellularAutomaton({ cells: N, rule: c.target });
        const obs = G.names.map((name, j) => ({
          name,
          inputs: Array.from({ length: c.k }, (_, i) => j * c.k + i),
          table: Uint8Array.from(c.table),
        }));
        const r = coarseGrain(F, obs, c.time);
        expect(r.closes).toBe(true);
        expect(Array.from(successorsOfNetwork(r.target!))).toEqual(Array.from(successorsOfNetwork(G)));
        expect(verifyCertificate(coarseGrainingCertificate(F, G, c.time, obs)).valid).toBe(true);
      }
    }
  });
});
