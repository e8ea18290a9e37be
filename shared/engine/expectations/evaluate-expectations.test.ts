import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CancelledError } from "../errors";
import { networkFromFunctions } from "../network";
import { compileDefinition, readRuleText } from "../rules";
import { YEAST_RULE_TEXT } from "../rules/yeast-rule-text.test-support";
import { randomNK } from "../update/random-networks.test-support";
import type { AttractorMethod } from "./attractor-census";
import type { Assignment, Expectation, ExpectedOutcome } from "./expectation";
import { evaluateExpectation, evaluateExpectations, groupByCondition } from "./evaluate-expectations";
import { readExpectationsCsv } from "./expectations-csv";
import { referenceStatus } from "./reference-judge.test-support";

function expectation(outcome: ExpectedOutcome, more: Partial<Expectation> = {}): Expectation {
  return {
    id: "e",
    update: "synchronous",
    condition: { knockOut: [], overExpress: [], inputs: {} },
    outcome,
    source: "test",
    note: "",
    ...more,
  };
}

/** A random expectation about nodes g0..g(n-1): any outcome kind, a knock-out and an over-expression at most. */
function expectationArb(n: number): fc.Arbitrary<Expectation> {
  const name = fc.integer({ min: 0, max: n - 1 }).map((i) => `g${i}`);
  const pattern: fc.Arbitrary<Assignment> = fc
    .uniqueArray(fc.tuple(name, fc.constantFrom<0 | 1>(0, 1)), { selector: ([x]) => x, minLength: 1, maxLength: 2 })
    .map((entries) => Object.fromEntries(entries));
  const comparison = fc.constantFrom("exactly" as const, "at-least" as const, "at-most" as const);
  const outcome: fc.Arbitrary<ExpectedOutcome> = fc.oneof(
    fc.record({
      kind: fc.constantFrom("some-attractor" as const, "every-attractor" as const, "no-attractor" as const),
      pattern,
    }),
    fc.record({
      kind: fc.constantFrom("fixed-point-count" as const, "attractor-count" as const),
      comparison,
      count: fc.integer({ min: 0, max: 4 }),
    }),
    fc.record({ kind: fc.constant("reachable" as const), from: pattern, pattern }),
  );
  return fc
    .record({
      update: fc.constantFrom("synchronous" as const, "asynchronous" as const),
      knockOut: fc.uniqueArray(name, { maxLength: 1 }),
      overExpress: fc.uniqueArray(name, { maxLength: 1 }),
      outcome,
    })
    .filter((r) => !r.knockOut.some((x) => r.overExpress.includes(x)))
    .map(({ update, knockOut, overExpress, outcome }) =>
      expectation(outcome, { update, condition: { knockOut, overExpress, inputs: {} } }),
    );
}

const networkCase = fc.record({
  n: fc.integer({ min: 2, max: 5 }),
  k: fc.integer({ min: 1, max: 3 }),
  seed: fc.integer(),
});
const SAT_ONLY = { exactSynchronousMaxNodes: 0, exactAsynchronousMaxNodes: 0 } as const;

describe("evaluateExpectations", () => {
  it("evaluateExpectation decides every expectation on small networks exactly as the definitions do", () => {
    fc.assert(
      fc.property(
        networkCase.chain((c) =>
          fc.tuple(fc.constant(c), fc.array(expectationArb(c.n), { minLength: 1, maxLength: 6 })),
        ),
        ([{ n, k, seed }, table]) => {
          const net = randomNK(n, k, seed);
          const results = evaluateExpectations(net, table);
          results.forEach((r, q) => {
            expect(r.status).toBe(referenceStatus(net, table[q]!));
            expect(r.method).toMatch(/^exact-/);
          });
        },
      ),
      { seed: 1502, numRuns: 200 },
    );
  });

  it("evaluateExpectation by SAT and trajectories never contradicts the definitions, and decides fixed-point counts", () => {
    fc.assert(
      fc.property(
        networkCase.chain((c) => fc.tuple(fc.constant(c), expectationArb(c.n))),
        ([{ n, k, seed }, e]) => {
          const net = randomNK(n, k, seed);
          const r = evaluateExpectation(net, e, SAT_ONLY);
          const truth = referenceStatus(net, e);
          expect([truth, "undecided"]).toContain(r.status);
          if (e.outcome.kind === "fixed-point-count") expect(r.status).toBe(truth);
          if (e.outcome.kind === "reachable" && e.update === "synchronous") expect(r.status).toBe(truth);
          if (r.status === "undecided") expect(r.reason).not.toBeNull();
          expect(r.method).not.toMatch(/^exact-/);
        },
      ),
      { seed: 1503, numRuns: 80 },
    );
  });

  it("evaluateExpectation by SAT leaves 'some attractor' undecided with the cycle bound when only a long cycle has the pattern", () => {
    // A 3-bit counter with a reset: a single cycle through all 8 states. Only its state 111 has a=b=c=1.
    const counter = networkFromFunctions(["a", "b", "c"], [[0], [0, 1], [0, 1, 2]], (node, x) =>
      node === 0 ? 1 - x[0]! : node === 1 ? x[0]! ^ x[1]! : (x[0]! & x[1]!) ^ x[2]!,
    );
    const some = expectation({ kind: "some-attractor", pattern: { a: 1 } });
    expect(evaluateExpectation(counter, some).status).toBe("fail");
    const bySat = evaluateExpectation(counter, some, { ...SAT_ONLY, maxCycleLength: 4 });
    expect(bySat).toMatchObject({ status: "undecided", method: "sat-cycles", reason: "cycle-bound" });
    expect(bySat.detail).toBe("a cycle longer than 4 may exist");
    const count = evaluateExpectation(
      counter,
      expectation({ kind: "fixed-point-count", comparison: "exactly", count: 0 }),
      SAT_ONLY,
    );
    expect(count).toMatchObject({ status: "pass", method: "sat-fixed-points" });
    const cycle = evaluateExpectation(
      counter,
      expectation({ kind: "attractor-count", comparison: "exactly", count: 1 }),
    );
    expect(cycle).toMatchObject({
      status: "pass",
      method: "exact-synchronous",
      detail: "1 attractor; expected exactly 1",
    });
  });

  it("evaluateExpectation says which node a model lacks, and refuses an input condition on a regulated node", () => {
    const net = randomNK(4, 2, 3);
    const missing = evaluateExpectation(net, expectation({ kind: "some-attractor", pattern: { Cyst: 1 } }));
    expect(missing).toMatchObject({ status: "undecided", method: "none", reason: "unknown-node" });
    expect(missing.detail).toBe("the outcome names node Cyst, not in this model");
    const ko = evaluateExpectation(
      net,
      expectation(
        { kind: "attractor-count", comparison: "at-least", count: 1 },
        { condition: { knockOut: ["Lum", "g1"], overExpress: [], inputs: {} } },
      ),
    );
    expect(ko.detail).toBe("the condition names node Lum, not in this model");
    const regulated = evaluateExpectation(
      net,
      expectation(
        { kind: "attractor-count", comparison: "at-least", count: 1 },
        { condition: { knockOut: [], overExpress: [], inputs: { g0: 1 } } },
      ),
    );
    expect(regulated).toMatchObject({ status: "undecided", reason: "bad-condition" });
    expect(regulated.detail).toMatch(/not an input/);
  });

  it("evaluateExpectation holds an input condition: with the signal on, the follower is on in every attractor", () => {
    // signal' = signal (an input), follower' = signal.
    const net = networkFromFunctions(["signal", "follower"], [[0], [0]], (_node, x) => x[0]!);
    const on = { knockOut: [], overExpress: [], inputs: { signal: 1 as const } };
    const every = expectation({ kind: "every-attractor", pattern: { follower: 1 } }, { condition: on });
    expect(evaluateExpectation(net, every).status).toBe("pass");
    expect(evaluateExpectation(net, { ...every, condition: { ...on, inputs: {} } }).status).toBe("fail");
  });

  it("evaluateExpectations leaves asynchronous cycles of large models to the trap-space method and uses one when given", () => {
    // A 30-node chain of copies driven by a negative 2-loop: far above the exact limit, no fixed point.
    const n = 30;
    const regulators = Array.from({ length: n }, (_, i) => (i === 0 ? [1] : i === 1 ? [0] : [i - 1]));
    const net = networkFromFunctions(
      Array.from({ length: n }, (_, i) => `g${i}`),
      regulators,
      (node, x) => (node === 1 ? 1 - x[0]! : x[0]!),
    );
    const some = expectation({ kind: "some-attractor", pattern: { g0: 1 } }, { update: "asynchronous" });
    const plain = evaluateExpectation(net, some);
    expect(plain).toMatchObject({ status: "undecided", method: "sat-fixed-points", reason: "needs-trap-spaces" });
    // A stand-in for the trap-space method: it reports one attractor with every node unknown but g0..g1 free.
    const calls: string[] = [];
    const stub: AttractorMethod = {
      name: "trap-spaces",
      accepts: (_net, update, scope) => update === "asynchronous" && scope.kind === "all",
      census: () => {
        calls.push("census");
        return {
          method: "trap-spaces",
          attractors: [{ reading: "~~" + "*".repeat(n - 2), size: null, states: [] }],
          complete: true,
          fixedPointsComplete: true,
          gap: null,
        };
      },
    };
    const every = expectation({ kind: "every-attractor", pattern: { g0: 1 } }, { id: "f", update: "asynchronous" });
    const results = evaluateExpectations(net, [some, every], { methods: [stub] });
    expect(results.map((r) => [r.status, r.method])).toEqual([
      ["fail", "trap-spaces"],
      ["fail", "trap-spaces"],
    ]);
    expect(calls).toEqual(["census"]);
  });

  it("evaluateExpectations answers synchronous reachability on a 40-node model by one trajectory", () => {
    // A ring of 40 copies rotates its state: from a single 1 the trajectory is a cycle of 40 states.
    const n = 40;
    const net = networkFromFunctions(
      Array.from({ length: n }, (_, i) => `r${i}`),
      Array.from({ length: n }, (_, i) => [(i + n - 1) % n]),
      (_node, x) => x[0]!,
    );
    const reach = (pattern: Assignment) =>
      evaluateExpectation(net, expectation({ kind: "reachable", from: { r0: 1 }, pattern }));
    expect(reach({ r5: 0 })).toMatchObject({ status: "fail", method: "synchronous-trajectory" });
    expect(reach({ r5: 0 }).detail).toMatch(/^the only reachable attractor does not have r5=0$/);
    expect(
      evaluateExpectation(net, expectation({ kind: "reachable", from: { r0: 0 }, pattern: { r5: 0 } })),
    ).toMatchObject({
      status: "pass",
      witness: { size: 1 },
    });
  });

  it("evaluateExpectations passes every expectation of the yeast cell-cycle fixture of Li et al. (PNAS 2004)", () => {
    // Li, Long, Lu, Ouyang, Tang, "The yeast cell-cycle network is robustly designed", PNAS 2004: the fixture names,
    // row by row, what the paper reports about the fixed points (values from memory); the model is the rule-text
    // reconstruction of its Fig. 1 (wiring from memory).
    const table = readExpectationsCsv(
      readFileSync(
        new URL("../../../tests/fixtures/expectations/li-2004-yeast-cell-cycle.csv", import.meta.url),
        "utf8",
      ),
    );
    const net = compileDefinition(readRuleText(YEAST_RULE_TEXT));
    for (const e of table) expect(e.source).toMatch(/Li et al\., .*PNAS 2004/);
    const results = evaluateExpectations(net, table);
    expect(results.map((r) => [r.id, r.status, r.method])).toEqual(
      table.map((e) => [e.id, "pass", "exact-synchronous"]),
    );
    // The same table by SAT (forced, as for a large model): fixed points decide the counts and the seven rows,
    // while the claim that no other attractor exists stays open beyond the cycle bound.
    const bySat = evaluateExpectations(net, table, SAT_ONLY);
    expect(bySat.filter((r) => r.status !== "pass").map((r) => [r.id, r.status, r.reason])).toEqual([
      ["li2004-only-fixed-points", "undecided", "cycle-bound"],
      ["li2004-mitotic-off", "undecided", "cycle-bound"],
    ]);
  });

  it("groupByCondition groups expectations by condition whatever the order of the names, and sharding by group changes no result", () => {
    const net = randomNK(6, 2, 11);
    const cond = (knockOut: string[]) => ({ knockOut, overExpress: [], inputs: {} });
    const count = { kind: "attractor-count", comparison: "at-least", count: 2 } as const;
    const table = [
      expectation(count, { id: "a", condition: cond(["g0", "g1"]) }),
      expectation({ kind: "some-attractor", pattern: { g2: 1 } }, { id: "b", condition: cond([]) }),
      expectation({ kind: "no-attractor", pattern: { g3: 0 } }, { id: "c", condition: cond(["g1", "g0"]) }),
    ];
    const groups = groupByCondition(table);
    expect(groups).toEqual([[0, 2], [1]]);
    const sharded = groups.flatMap((g) =>
      evaluateExpectations(
        net,
        g.map((i) => table[i]!),
      ),
    );
    expect(sharded.sort((x, y) => (x.id < y.id ? -1 : 1))).toEqual(evaluateExpectations(net, table));
  });

  it("evaluateExpectations reports progress up to 1 and stops with CancelledError on request", () => {
    const net = randomNK(12, 2, 8);
    const table = [0, 1, 2].map((i) =>
      expectation(
        { kind: "attractor-count", comparison: "at-least", count: 1 },
        { id: `e${i}`, condition: { knockOut: [`g${i}`], overExpress: [], inputs: {} } },
      ),
    );
    const fractions: number[] = [];
    evaluateExpectations(net, table, { onProgress: (f) => fractions.push(f) });
    expect(fractions.at(-1)).toBe(1);
    expect(fractions.every((f, i) => i === 0 || f >= fractions[i - 1]!)).toBe(true);
    let calls = 0;
    expect(() => evaluateExpectations(net, table, { shouldStop: () => ++calls > 1 })).toThrow(CancelledError);
  });
});
