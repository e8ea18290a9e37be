import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { sameAssignment } from "./expectation";

const assignment = fc.dictionary(fc.constantFrom("A", "B", "C", "toString", "__proto__x"), fc.constantFrom(0, 1));

describe("sameAssignment", () => {
  it("agrees with comparing the sorted entries, whatever order the keys were written in", () => {
    fc.assert(
      fc.property(assignment, assignment, (a, b) => {
        const sorted = (x: Record<string, number>) => JSON.stringify(Object.entries(x).sort());
        const shuffled = Object.fromEntries(Object.entries(a).reverse()) as typeof a;
        expect(sameAssignment(a, b)).toBe(sorted(a) === sorted(b));
        expect(sameAssignment(a, shuffled)).toBe(true);
      }),
      { seed: 20261203, numRuns: 300 },
    );
  });

  it("does not take an inherited property for a node", () => {
    expect(sameAssignment({ toString: 1 } as never, {})).toBe(false);
    expect(sameAssignment({}, { toString: 1 } as never)).toBe(false);
  });
});
