import fc from "fast-check";
import seedrandom from "seedrandom";
import { describe, expect, it } from "vitest";
import { checkNetwork, type BooleanNetwork } from "../network";
import { randomNetwork } from "../emulation";
import { coarseGrain, coarseGrainBySat, nodeObservable } from "./index";

/** F^t of a state by plain simulation (node-ordered 0/1 text in and out). */
function imageOf(net: BooleanNetwork, text: string, t: number): string {
  let x = [...text].map(Number);
  for (let s = 0; s < t; s++)
    x = x.map((_, i) => net.tables[i]![Array.from(net.regulators[i]!).reduce((row, r, j) => row | (x[r]! << j), 0)]!);
  return x.join("");
}

/** Plain reference: observed labels of every state and of its image, closed when no label has two image labels. */
function closesByBruteForce(net: BooleanNetwork, observed: readonly number[], t: number): Map<string, string> | null {
  const n = net.names.length;
  const seen = new Map<string, string>();
  for (let x = 0; x < 2 ** n; x++) {
    const text = Array.from({ length: n }, (_, i) => (x >> i) & 1).join("");
    const image = imageOf(net, text, t);
    const from = observed.map((o) => text[o]).join("");
    const to = observed.map((o) => image[o]).join("");
    if (seen.has(from) && seen.get(from) !== to) return null;
    seen.set(from, to);
  }
  return seen;
}

describe("coarseGrainBySat", () => {
  it("coarseGrainBySat agrees with brute force over all states of random networks of up to 10 nodes", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 10 }),
        fc.integer({ min: 1, max: 3 }),
        fc.integer({ min: 1, max: 3 }),
        fc.integer(),
        fc.integer({ min: 1, max: 4 }),
        (n, k, t, seed, observedCount) => {
          const rng = seedrandom(`brute-${seed}`);
          const net = randomNetwork(rng, n, Math.min(k, n));
          const observed = [
            ...new Set(Array.from({ length: Math.min(observedCount, n) }, () => Math.floor(rng() * n))),
          ];
          const reference = closesByBruteForce(net, observed, t);
          const bySat = coarseGrainBySat(net, observed, t);
          expect(bySat.closes).toBe(reference !== null);
          if (reference) {
            // The target's successor of each observed label is the one every state with that label goes to.
            for (const [from, to] of reference) expect(imageOf(bySat.target!, from, 1)).toBe(to);
          } else {
            // A genuine counterexample: equal on the observed nodes, images by plain simulation, differing there.
            const { states, images, differingNodes } = bySat.counterexample!;
            for (const o of observed) expect(states[0][o]).toBe(states[1][o]);
            expect(images).toEqual([imageOf(net, states[0], t), imageOf(net, states[1], t)]);
            const differ = observed.filter((o) => images[0][o] !== images[1][o]).map((o) => net.names[o]);
            expect(differingNodes).toEqual(differ);
            expect(differ.length).toBeGreaterThan(0);
          }
        },
      ),
      { seed: 4410, numRuns: 200 },
    );
  });

  it("coarseGrainBySat agrees with the tabulating coarseGrain on random networks of up to 12 nodes", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 12 }),
        fc.integer({ min: 1, max: 3 }),
        fc.integer({ min: 1, max: 4 }),
        fc.integer(),
        fc.integer({ min: 1, max: 3 }),
        (n, k, t, seed, observedCount) => {
          const rng = seedrandom(String(seed));
          const net = randomNetwork(rng, n, Math.min(k, n));
          const observed = [
            ...new Set(Array.from({ length: Math.min(observedCount, n) }, () => Math.floor(rng() * n))),
          ];
          const exact = coarseGrain(
            net,
            observed.map((o) => nodeObservable(net, o)),
            t,
          );
          const bySat = coarseGrainBySat(net, observed, t);
          expect(bySat.closes).toBe(exact.closes);
          if (exact.closes) expect(bySat.target).toEqual(exact.target);
          else {
            const { states, images } = bySat.counterexample!;
            for (const o of observed) expect(states[0][o]).toBe(states[1][o]);
            expect(images).toEqual([imageOf(net, states[0], t), imageOf(net, states[1], t)]);
            expect(observed.some((o) => images[0][o] !== images[1][o])).toBe(true);
          }
        },
      ),
      { seed: 1230, numRuns: 150 },
    );
  });

  it("coarseGrainBySat finds the planted closing module of a 130-node source and a counterexample one step earlier", () => {
    // Planted: a relay loop a' = h, h' = a among 128 noise nodes that read anything. Observing a alone, its next
    // value is the hidden h, so {a} does not close at t = 1; two steps later a is back (a'' = h' = a), so {a} closes
    // at t = 2 onto the identity a' = a, and only a and h lie in the cone.
    const rng = seedrandom("planted-130");
    const noise = randomNetwork(rng, 130, 3);
    const net = checkNetwork({
      names: ["a", "h", ...noise.names.slice(2)],
      regulators: [Int32Array.of(1), Int32Array.of(0), ...noise.regulators.slice(2)],
      tables: [Uint8Array.of(0, 1), Uint8Array.of(0, 1), ...noise.tables.slice(2)],
    });
    const two = coarseGrainBySat(net, [0], 2);
    expect(two.closes).toBe(true);
    expect(Array.from(two.target!.tables[0]!)).toEqual([0, 1]);
    expect(two.coneNodes).toBe(2);
    const one = coarseGrainBySat(net, [0], 1);
    expect(one.closes).toBe(false);
    const [x, y] = one.counterexample!.states;
    expect(x[0]).toBe(y[0]);
    expect(x[1]).not.toBe(y[1]);
  });

  it("coarseGrainBySat closes a 3-node module with 150 noise nodes and returns its dynamics", () => {
    // The first three nodes form a repressor ring (a' = !c, b' = !a, c' = !b) that reads only itself; 150 noise
    // nodes read anything, including the ring. The ring closes at every t, onto the t-th power of its own map.
    const rng = seedrandom("ring-153");
    const noise = randomNetwork(rng, 153, 2);
    const ring = [Int32Array.of(2), Int32Array.of(0), Int32Array.of(1)];
    const net = checkNetwork({
      names: ["a", "b", "c", ...noise.names.slice(3)],
      regulators: [...ring, ...noise.regulators.slice(3)],
      tables: [Uint8Array.of(1, 0), Uint8Array.of(1, 0), Uint8Array.of(1, 0), ...noise.tables.slice(3)],
    });
    const result = coarseGrainBySat(net, [0, 1, 2], 1);
    expect(result.closes).toBe(true);
    expect(result.target!.names).toEqual(["a", "b", "c"]);
    expect(Array.from(result.target!.regulators, (r) => Array.from(r))).toEqual([[2], [0], [1]]);
    // Adding an observed node d' = a & e, where e is a noise node, breaks closure: with a = 1, d follows e.
    const withD = checkNetwork({
      names: [...net.names],
      regulators: [...net.regulators.slice(0, 3), Int32Array.of(0, 4), ...net.regulators.slice(4)],
      tables: [...net.tables.slice(0, 3), Uint8Array.of(0, 0, 0, 1), ...net.tables.slice(4)],
    });
    const broken = coarseGrainBySat(withD, [0, 1, 2, 3], 1);
    expect(broken.closes).toBe(false);
    expect(broken.counterexample!.differingNodes).toEqual([net.names[3]]);
  });
});
