import { describe, expect, it } from "vitest";
import { structureSummary } from "./structure-summary";

describe("structureSummary", () => {
  it("finds the one negative circuit of a three-gene repressor ring, each NOT of sensitivity 1", () => {
    // Common practice: a ring of three repressions is a negative feedback circuit (an odd number of negative edges);
    // a one-input NOT changes with its input on every row, so its average sensitivity is 1.
    const s = structureSummary("a' = !c\nb' = !a\nc' = !b\n");
    expect(s.circuits).toEqual([{ nodes: ["a", "b", "c"], sign: "negative" }]);
    expect(s.circuitsComplete).toBe(true);
    expect(s.averageSensitivity).toBe(1);
  });

  it("reports AND's canalizing inputs, its sensitivity and a regulator that does not matter", () => {
    // Common practice: x AND y is canalized by either input at 0 (output 0); each of its two inputs flips the output
    // on half of the rows, so its average sensitivity is 2 x 1/2 = 1. z & !z never changes the rule's value.
    const s = structureSummary("x' = x\ny' = y\nz' = x & y | z & !z\n");
    expect(s.sensitivity.find((n) => n.node === "z")!.value).toBe(1);
    expect(s.canalizing.filter((c) => c.node === "z")).toEqual([
      { node: "z", regulator: "x", inputValue: 0, output: 0 },
      { node: "z", regulator: "y", inputValue: 0, output: 0 },
    ]);
    expect(s.nonEssential).toEqual([{ node: "z", regulator: "z" }]);
  });
});
