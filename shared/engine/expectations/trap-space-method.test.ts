import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { compileDefinition, readRuleText } from "../rules";
import { randomNK } from "../update/random-networks.test-support";
import type { Assignment, Expectation, ExpectedOutcome } from "./expectation";
import { evaluateExpectations } from "./evaluate-expectations";
import { referenceStatus } from "./reference-judge.test-support";
import { TRAP_SPACE_METHOD, trapSpaceMethod } from "./trap-space-method";

const TRAP_SPACES_ONLY = { exactSynchronousMaxNodes: 0, exactAsynchronousMaxNodes: 0, methods: [trapSpaceMethod()] };

function asyncExpectation(outcome: ExpectedOutcome): Expectation {
  return {
    id: "e",
    update: "asynchronous",
    condition: { knockOut: [], overExpress: [], inputs: {} },
    outcome,
    source: "test",
    note: "",
  };
}

describe("trapSpaceMethod", () => {
  it("trapSpaceMethod never contradicts the exact asynchronous answer on small random networks", () => {
    const outcome = (n: number): fc.Arbitrary<ExpectedOutcome> => {
      const pattern: fc.Arbitrary<Assignment> = fc
        .uniqueArray(
          fc.tuple(
            fc.integer({ min: 0, max: n - 1 }).map((i) => `g${i}`),
            fc.constantFrom<0 | 1>(0, 1),
          ),
          {
            selector: ([x]) => x,
            minLength: 1,
            maxLength: 2,
          },
        )
        .map((entries) => Object.fromEntries(entries));
      return fc.oneof(
        fc.record({
          kind: fc.constantFrom("some-attractor" as const, "every-attractor" as const, "no-attractor" as const),
          pattern,
        }),
        fc.record({
          kind: fc.constantFrom("fixed-point-count" as const, "attractor-count" as const),
          comparison: fc.constantFrom("exactly" as const, "at-least" as const, "at-most" as const),
          count: fc.integer({ min: 0, max: 4 }),
        }),
      );
    };
    fc.assert(
      fc.property(
        fc
          .record({ n: fc.integer({ min: 2, max: 6 }), k: fc.integer({ min: 1, max: 3 }), seed: fc.integer() })
          .chain((c) => fc.tuple(fc.constant(c), fc.array(outcome(c.n), { minLength: 1, maxLength: 5 }))),
        ([{ n, k, seed }, outcomes]) => {
          const net = randomNK(n, k, seed);
          const table = outcomes.map(asyncExpectation);
          const results = evaluateExpectations(net, table, TRAP_SPACES_ONLY);
          results.forEach((r, q) => {
            if (r.status !== "undecided") expect(r.status).toBe(referenceStatus(net, table[q]!));
          });
        },
      ),
      { seed: 15, numRuns: 80 },
    );
  });

  it("trapSpaceMethod passes 'some attractor has A=1' on a toggle switch and names itself (common practice)", () => {
    const net = compileDefinition(readRuleText("A' = !B\nB' = !A\n"));
    const [r] = evaluateExpectations(
      net,
      [asyncExpectation({ kind: "some-attractor", pattern: { A: 1 } })],
      TRAP_SPACES_ONLY,
    );
    expect(r).toMatchObject({ status: "pass", method: TRAP_SPACE_METHOD });
  });

  it("trapSpaceMethod leaves 'every attractor has A=1' undecided with its reason when it cannot prove it", () => {
    const net = compileDefinition(readRuleText("A' = 1\nB' = !B\n"));
    const [r] = evaluateExpectations(
      net,
      [asyncExpectation({ kind: "every-attractor", pattern: { A: 1 } })],
      TRAP_SPACES_ONLY,
    );
    expect(r).toMatchObject({ status: "undecided", reason: "outside-trap-spaces", method: TRAP_SPACE_METHOD });
  });
});
