import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { hierarchySymmetryClasses, symmetryClassOf, witnessChecks } from "./eca-engine";

describe("witnessChecks", () => {
  it("witnessChecks confirms rule 18 emulating rule 90 with codewords 00 and 10 (worked by hand in the in-app help)", () => {
    const { verified, checks } = witnessChecks(18, 90, { time: 2, encoding: { "0": "00", "1": "10" } });
    expect(verified).toBe(true);
    expect(checks.map((c) => c.neighbourhood)).toEqual(["111", "110", "101", "100", "011", "010", "001", "000"]);
    expect(checks.find((c) => c.neighbourhood === "100")).toMatchObject({
      input: "100000",
      obtained: "10",
      expectedBit: 1,
      agrees: true,
    });
    expect(checks.find((c) => c.neighbourhood === "101")).toMatchObject({
      input: "100010",
      obtained: "00",
      expectedBit: 0,
      agrees: true,
    });
  });

  it("witnessChecks reports the verifier's verdict exactly when all eight displayed rows agree", () => {
    const word = (k: number) =>
      fc.array(fc.constantFrom("0", "1"), { minLength: k, maxLength: k }).map((a) => a.join(""));
    const arb = fc.integer({ min: 1, max: 5 }).chain((k) =>
      fc.record({
        source: fc.integer({ min: 0, max: 255 }),
        target: fc.integer({ min: 0, max: 255 }),
        u0: word(k),
        u1: word(k),
        time: fc.integer({ min: 1, max: k }),
      }),
    );
    fc.assert(
      fc.property(arb, ({ source, target, u0, u1, time }) => {
        fc.pre(u0 !== u1);
        const { verified, checks } = witnessChecks(source, target, { time, encoding: { "0": u0, "1": u1 } });
        expect(verified).toBe(checks.every((c) => c.agrees));
      }),
      { seed: 6, numRuns: 2000 },
    );
  });
});

describe("symmetryClassOf", () => {
  it("symmetryClassOf puts rule 110 with its reflection 124, complement 137 and both 193, among 88 classes", () => {
    // Li & Packard, "The structure of the elementary cellular automata rule space", Complex Systems 4 (1990)
    expect(symmetryClassOf(110)).toEqual([110, 124, 137, 193]);
    expect(hierarchySymmetryClasses()).toHaveLength(88);
  });
});
