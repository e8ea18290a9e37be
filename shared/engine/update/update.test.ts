import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { networkFromFunctions } from "../network";
import { bytesFromString, bytesToString, successorTable, synchronousStep, trajectory } from "./index";
import { CancelledError } from "../errors";
import { randomNK, slowSuccessor, text } from "./random-networks.test-support";

describe("update", () => {
  it("successorTable agrees with one-state-at-a-time evaluation on random networks of 1 to 12 nodes", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 12 }), fc.integer({ min: 0, max: 4 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, k, seed);
        const table = successorTable(net);
        expect(table.length).toBe(2 ** n);
        for (let s = 0; s < table.length; s++) expect(table[s]).toBe(slowSuccessor(net, s));
      }),
      { seed: 21, numRuns: 80 },
    );
  });

  it("successorTable agrees with the reference on sampled states of a 20-node network", () => {
    const net = randomNK(20, 3, 5);
    const table = successorTable(net);
    const rng = seedrandom("20");
    for (let q = 0; q < 5000; q++) {
      const s = Math.floor(rng() * 2 ** 20);
      expect(table[s]).toBe(slowSuccessor(net, s));
    }
  });

  it("successorTable throws CancelledError when shouldStop answers true", () => {
    expect(() => successorTable(randomNK(18, 2, 1), { shouldStop: () => true })).toThrow(CancelledError);
  });

  it("synchronousStep on bytes matches the successor table on the same state", () => {
    const net = randomNK(9, 3, 77);
    const table = successorTable(net);
    for (let s = 0; s < 512; s++)
      expect(bytesToString(synchronousStep(net, bytesFromString(text(s, 9))))).toBe(text(table[s]!, 9));
  });

  it("trajectory with the synchronous scheme follows the successor table and stops at the first repeat", () => {
    // A 3-node ring shifting values one place per step: 100 -> 010 -> 001 -> 100.
    const ring = networkFromFunctions(["a", "b", "c"], [[2], [0], [1]], (_n, x) => x[0]!);
    const rows = trajectory(ring, bytesFromString("100"), { scheme: "synchronous", steps: 10, stopAtRepeat: true }).map(
      bytesToString,
    );
    expect(rows).toEqual(["100", "010", "001", "100"]);
  });

  it("trajectory with the general asynchronous scheme changes at most one node per step and is reproducible per seed", () => {
    const net = randomNK(12, 2, 3);
    const run = (seed: string) =>
      trajectory(net, new Uint8Array(12), { scheme: "general-asynchronous", steps: 200, rng: seedrandom(seed) }).map(
        bytesToString,
      );
    const a = run("x");
    expect(run("x")).toEqual(a);
    for (let t = 1; t < a.length; t++) {
      let diff = 0;
      for (let i = 0; i < 12; i++) if (a[t]![i] !== a[t - 1]![i]) diff++;
      expect(diff).toBeLessThanOrEqual(1);
    }
  });

  it("trajectory with the random-order scheme equals a reference that applies the same permutation node by node", () => {
    const net = randomNK(10, 3, 8);
    const init = bytesFromString("0110100101");
    const rows = trajectory(net, init, { scheme: "random-order", steps: 30, rng: seedrandom("p") });
    // Reference: redraw the same permutations with the same generator and apply them one node at a time.
    const rng = seedrandom("p");
    const order = Array.from({ length: 10 }, (_, i) => i);
    let state = Array.from(init);
    for (let t = 1; t <= 30; t++) {
      for (let i = 9; i > 0; i--) {
        const j = Math.floor(rng() * (i + 1));
        [order[i], order[j]] = [order[j]!, order[i]!];
      }
      for (const node of order) {
        const idx = state.reduce((acc, v, i) => acc + v * 2 ** i, 0);
        state[node] = Math.floor(slowSuccessor(net, idx) / 2 ** node) % 2;
      }
      expect(Array.from(rows[t]!)).toEqual(state);
      state = [...state];
    }
  });

  it("trajectory with an asynchronous scheme and no generator is refused", () => {
    expect(() => trajectory(randomNK(3, 1, 1), new Uint8Array(3), { scheme: "random-order", steps: 1 })).toThrow(
      /seeded/,
    );
  });
});
