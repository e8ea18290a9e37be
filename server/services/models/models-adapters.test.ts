import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { networkFromFunctions, type BooleanNetwork } from "@shared/engine/network";
import { compileDefinition, networkToDefinition, printRuleText, readRuleText } from "@shared/engine/rules";
import { bytesFromString, bytesToString, synchronousStep } from "@shared/engine/update";
import { ruleTextIssues } from "./model-reading";
import { perturbedNetwork } from "./perturbed-network";
import { structureView } from "./structure-view";
import { synchronousAttractors, withPhenotypes } from "./synchronous-view";

const SEED = { seed: 20261202, numRuns: 150 };

/** Random networks of 1..6 nodes named N0..: each node reads 0..3 distinct nodes through a random table. */
const networkArb: fc.Arbitrary<BooleanNetwork> = fc.integer({ min: 1, max: 6 }).chain((n) =>
  fc
    .array(
      fc.integer({ min: 0, max: Math.min(3, n) }).chain((k) =>
        fc.tuple(
          fc.shuffledSubarray(
            Array.from({ length: n }, (_, i) => i),
            { minLength: k, maxLength: k },
          ),
          fc.array(fc.integer({ min: 0, max: 1 }), { minLength: 1 << k, maxLength: 1 << k }),
        ),
      ),
      { minLength: n, maxLength: n },
    )
    .map((nodes) =>
      networkFromFunctions(
        nodes.map((_, i) => `N${i}`),
        nodes.map(([regs]) => regs),
        (node, x) => nodes[node]![1][x.reduce((row, bit, j) => row | (bit << j), 0)]!,
      ),
    ),
);

/** Plain reference: the sign from the set of output changes when input j goes from 0 to 1, row by row. */
function referenceSign(table: Uint8Array, j: number): string {
  const k = Math.log2(table.length);
  const changes = new Set<number>();
  for (let row = 0; row < table.length; row++) {
    const bits = Array.from({ length: k }, (_, b) => (row >> b) & 1);
    if (bits[j] === 1) continue;
    const up = [...bits];
    up[j] = 1;
    const upRow = up.reduce((r, bit, b) => r + bit * 2 ** b, 0);
    changes.add(table[upRow]! - table[row]!);
  }
  if (changes.has(1) && changes.has(-1)) return "dual";
  if (changes.has(1)) return "positive";
  if (changes.has(-1)) return "negative";
  return "non-essential";
}

describe("structureView", () => {
  it("signs every edge as a row-by-row reference does on random networks", () => {
    fc.assert(
      fc.property(networkArb, (net) => {
        for (const e of structureView(networkToDefinition(net), net, []).edges) {
          const target = net.names.indexOf(e.target);
          const j = Array.from(net.regulators[target]!).indexOf(net.names.indexOf(e.source));
          expect(e.sign).toBe(referenceSign(net.tables[target]!, j));
        }
      }),
      SEED,
    );
  });

  it("structureView reads activation, repression and the dual input of a xor (common practice)", () => {
    const definition = readRuleText("A' = A\nB' = A & !C\nC' = A ^ B\n");
    expect(structureView(definition, compileDefinition(definition), ["A"]).edges).toEqual([
      { source: "A", target: "A", sign: "positive" },
      { source: "A", target: "B", sign: "positive" },
      { source: "C", target: "B", sign: "negative" },
      { source: "A", target: "C", sign: "dual" },
      { source: "B", target: "C", sign: "dual" },
    ]);
  });
});

describe("withPhenotypes", () => {
  it("labels each marker 1 when always on, 0 when always off and ~ when it changes on the attractor", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 8 }).chain((n) =>
          fc.tuple(
            fc.array(
              fc.array(fc.constantFrom("0", "1"), { minLength: n, maxLength: n }).map((c) => c.join("")),
              { minLength: 1, maxLength: 6 },
            ),
            fc.array(fc.integer({ min: 0, max: n - 1 }), { minLength: 1, maxLength: n }),
          ),
        ),
        ([states, markers]) => {
          const nodes = Array.from({ length: states[0]!.length }, (_, i) => `N${i}`);
          const result = {
            nodes,
            stateCount: 0,
            maxTransient: 0,
            meanTransient: 0,
            attractors: [{ length: states.length, basin: 1, states, phenotype: null }],
          };
          const label = withPhenotypes(
            result,
            markers.map((m) => nodes[m]!),
          ).attractors[0]!.phenotype!;
          expect(label).toHaveLength(markers.length);
          markers.forEach((m, i) => {
            const values = states.map((s) => s[m]);
            const expected = values.every((v) => v === "1") ? "1" : values.every((v) => v === "0") ? "0" : "~";
            expect(label[i]).toBe(expected);
          });
        },
      ),
      SEED,
    );
  });
});

describe("perturbedNetwork", () => {
  it("fixes perturbed nodes and leaves every other node's update exactly as it was", () => {
    // choice per node: 0 untouched, 1 knocked out, 2 over-expressed, 3/4 a fixed condition at 0/1 (any node, input or not).
    fc.assert(
      fc.property(
        networkArb.chain((net) =>
          fc.tuple(
            fc.constant(net),
            fc.array(fc.constantFrom(0, 1, 2, 3, 4), { minLength: net.names.length, maxLength: net.names.length }),
            fc.nat(),
          ),
        ),
        ([net, choice, stateSeed]) => {
          const knockOut = net.names.filter((_, i) => choice[i] === 1);
          const overExpress = net.names.filter((_, i) => choice[i] === 2);
          const fixed = Object.fromEntries(
            net.names.flatMap((name, i) => (choice[i]! >= 3 ? [[name, (choice[i]! - 3) as 0 | 1]] : [])),
          );
          const view = perturbedNetwork(net, { knockOut, overExpress, fixed });
          const n = net.names.length;
          const state = bytesFromString(Array.from({ length: n }, (_, i) => String((stateSeed >> i) & 1)).join(""));
          const before = synchronousStep(net, state);
          const after = synchronousStep(view, state);
          for (let i = 0; i < n; i++) {
            if (choice[i] === 1 || choice[i] === 3) expect(after[i]).toBe(0);
            else if (choice[i] === 2 || choice[i] === 4) expect(after[i]).toBe(1);
            else expect(after[i]).toBe(before[i]);
          }
        },
      ),
      SEED,
    );
  });

  it("refuses a node fixed both ways and a node the model does not have", () => {
    const net = compileDefinition(readRuleText("A' = !B\nB' = !A\n"));
    expect(() => perturbedNetwork(net, { knockOut: ["A"], overExpress: ["A"], fixed: {} })).toThrow(/both 0 and 1/);
    expect(() => perturbedNetwork(net, { knockOut: ["Z"], overExpress: [], fixed: {} })).toThrow(/not a node/);
  });
});

describe("ruleTextIssues and synchronousAttractors", () => {
  it("accepts the printed text of any random network and finds the same attractors after the round trip", () => {
    fc.assert(
      fc.property(networkArb, (net) => {
        const text = printRuleText(networkToDefinition(net));
        const { issues, nodes, read } = ruleTextIssues(text);
        expect(issues).toEqual([]);
        expect(nodes).toEqual(net.names);
        expect(synchronousAttractors(read!.network)).toEqual(synchronousAttractors(net));
      }),
      { ...SEED, numRuns: 60 },
    );
  });

  it("reports a faulty line and an undefined node each at its own line and column", () => {
    const { issues, read } = ruleTextIssues("A' = A |\nB' = Q\n");
    expect(read).toBeNull();
    expect(issues.map((i) => [i.line, i.column])).toEqual([
      [1, 9],
      [2, 6],
    ]);
  });

  it("synchronousAttractors lists every cycle in the order the synchronous step follows", () => {
    fc.assert(
      fc.property(networkArb, (net) => {
        for (const a of synchronousAttractors(net).attractors) {
          a.states.forEach((s, i) =>
            expect(bytesToString(synchronousStep(net, bytesFromString(s)))).toBe(a.states[(i + 1) % a.states.length]),
          );
        }
      }),
      { ...SEED, numRuns: 60 },
    );
  });
});
