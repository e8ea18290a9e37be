import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { networkFromFunctions } from "../network";
import { randomNK } from "../update/random-networks.test-support";
import { canalizingInputs, feedbackCircuits, interactionGraph, networkSensitivity, tableSensitivity } from "./index";

const and2 = Uint8Array.of(0, 0, 0, 1);
const or2 = Uint8Array.of(0, 1, 1, 1);
const xor2 = Uint8Array.of(0, 1, 1, 0);

describe("structure", () => {
  it("interactionGraph signs AND inputs positive, NOT negative, XOR dual and an unused input non-essential", () => {
    // a' = b & c, b' = !a, c' = a xor b, d' = a (with d listed but unused)
    const net = networkFromFunctions(["a", "b", "c", "d"], [[1, 2], [0], [0, 1], [0, 3]], (node, x) =>
      node === 0 ? x[0]! & x[1]! : node === 1 ? 1 - x[0]! : node === 2 ? x[0]! ^ x[1]! : x[0]!,
    );
    const g = interactionGraph(net);
    const sign = (s: number, t: number) => g.edges.find((e) => e.source === s && e.target === t)!.sign;
    expect([sign(1, 0), sign(2, 0), sign(0, 1), sign(0, 2), sign(1, 2), sign(0, 3), sign(3, 3)]).toEqual([
      "positive",
      "positive",
      "negative",
      "dual",
      "dual",
      "positive",
      "non-essential",
    ]);
    expect(Array.from(g.inDegree)).toEqual([2, 1, 2, 1]);
    expect(Array.from(g.outDegree)).toEqual([3, 2, 1, 0]);
  });

  it("interactionGraph agrees with a flip-every-row reference on random networks", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 8 }), fc.integer({ min: 0, max: 4 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, k, seed);
        for (const e of interactionGraph(net).edges) {
          const j = Array.from(net.regulators[e.target]!).indexOf(e.source);
          const t = net.tables[e.target]!;
          const diffs = new Set<number>();
          for (let row = 0; row < t.length; row++) if (!((row >> j) & 1)) diffs.add(t[row | (1 << j)]! - t[row]!);
          const expected =
            diffs.has(1) && diffs.has(-1)
              ? "dual"
              : diffs.has(1)
                ? "positive"
                : diffs.has(-1)
                  ? "negative"
                  : "non-essential";
          expect(e.sign).toBe(expected);
        }
      }),
      { seed: 71, numRuns: 80 },
    );
  });

  it("feedbackCircuits equals brute-force enumeration of vertex sequences on random networks", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 6 }),
        fc.integer({ min: 1, max: 3 }),
        fc.integer(),
        fc.integer({ min: 1, max: 6 }),
        (n, k, seed, maxLength) => {
          const net = randomNK(n, k, seed);
          const g = interactionGraph(net);
          const sign = new Map(
            g.edges.filter((e) => e.sign !== "non-essential").map((e) => [`${e.source}>${e.target}`, e.sign]),
          );
          const expected: string[] = [];
          const visit = (seq: number[]) => {
            const closing = sign.get(`${seq.at(-1)}>${seq[0]}`);
            const inner = seq.slice(1).map((v, q) => sign.get(`${seq[q]}>${v}`));
            if (closing && inner.every(Boolean)) {
              const all = [...inner, closing];
              const s = all.includes("dual")
                ? "dual"
                : all.filter((x) => x === "negative").length % 2
                  ? "negative"
                  : "positive";
              expected.push(`${seq.join(",")}:${s}`);
            }
            if (seq.length < maxLength) for (let v = seq[0]! + 1; v < n; v++) if (!seq.includes(v)) visit([...seq, v]);
          };
          for (let s = 0; s < n; s++) visit([s]);
          const found = feedbackCircuits(net, maxLength);
          expect(found.complete).toBe(true);
          expect(found.circuits.map((c) => `${c.nodes.join(",")}:${c.sign}`).sort()).toEqual(expected.sort());
        },
      ),
      { seed: 72, numRuns: 150 },
    );
  });

  it("feedbackCircuits with an unbounded length (Johnson's blocking) agrees with the length-pruned search below n", () => {
    fc.assert(
      fc.property(fc.integer({ min: 7, max: 11 }), fc.integer({ min: 1, max: 3 }), fc.integer(), (n, k, seed) => {
        const net = randomNK(n, k, seed);
        const key = (c: { nodes: number[]; sign: string }) => `${c.nodes.join(",")}:${c.sign}`;
        const all = feedbackCircuits(net, n).circuits;
        const pruned = feedbackCircuits(net, n - 1).circuits;
        expect(
          all
            .filter((c) => c.nodes.length < n)
            .map(key)
            .sort(),
        ).toEqual(pruned.map(key).sort());
        expect(new Set(all.map(key)).size).toBe(all.length);
      }),
      { seed: 73, numRuns: 40 },
    );
  });

  it("feedbackCircuits finds the sum over L of C(n,L)(L-1)! circuits of a complete digraph with self-loops", () => {
    // Counting fact (common practice): a complete digraph with loops on 5 vertices has 5 + 10 + 20 + 30 + 24 = 89
    // elementary circuits. Each node here is the OR of all nodes.
    const n = 5;
    const net = networkFromFunctions(
      Array.from({ length: n }, (_, i) => `v${i}`),
      Array.from({ length: n }, () => [0, 1, 2, 3, 4]),
      (_n, x) => (x.some((v) => v === 1) ? 1 : 0),
    );
    expect(feedbackCircuits(net, 5).circuits).toHaveLength(89);
    expect(feedbackCircuits(net, 2).circuits).toHaveLength(15);
    expect(feedbackCircuits(net, 5, 10)).toMatchObject({ complete: false });
    expect(feedbackCircuits(net, 5).circuits.every((c) => c.sign === "positive")).toBe(true);
  });

  it("tableSensitivity is 1 for two-input AND and OR and K for K-input XOR", () => {
    expect(tableSensitivity(and2)).toBe(1);
    expect(tableSensitivity(or2)).toBe(1);
    expect(tableSensitivity(xor2)).toBe(2);
    expect(tableSensitivity(Uint8Array.of(0, 1, 1, 0, 1, 0, 0, 1))).toBe(3);
  });

  it("networkSensitivity of large random NK networks is close to 2p(1-p)K, which is 1 at the critical K=2, p=0.5", () => {
    // Shmulevich and Kauffman, "Activities and sensitivities in Boolean network models", PRL 2004: expected average
    // sensitivity 2p(1-p)K; K=2, p=0.5 gives 1, the critical value (common practice).
    expect(networkSensitivity(randomNK(4000, 2, 1, 0.5))).toBeCloseTo(1, 1);
    expect(networkSensitivity(randomNK(4000, 3, 2, 0.5))).toBeCloseTo(1.5, 1);
    expect(networkSensitivity(randomNK(4000, 4, 3, 0.25))).toBeCloseTo(1.5, 1);
  });

  it("canalizingInputs reports each AND input canalizing at 0, each OR input at 1, and none for XOR", () => {
    const net = networkFromFunctions(
      ["a", "b", "c"],
      [
        [1, 2],
        [0, 2],
        [0, 1],
      ],
      (node, x) => (node === 0 ? x[0]! & x[1]! : node === 1 ? x[0]! | x[1]! : x[0]! ^ x[1]!),
    );
    expect(canalizingInputs(net)).toEqual([
      { node: 0, position: 0, regulator: 1, inputValue: 0, output: 0 },
      { node: 0, position: 1, regulator: 2, inputValue: 0, output: 0 },
      { node: 1, position: 0, regulator: 0, inputValue: 1, output: 1 },
      { node: 1, position: 1, regulator: 2, inputValue: 1, output: 1 },
    ]);
  });
});
