import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  ecaRule,
  ecaNumber,
  reflectEca,
  complementEca,
  reflectRule,
  complementRule,
  ruleFromNumber,
  ruleNumber,
  ecaSymmetryClasses,
  ecaSymmetryImages,
  stepWord,
} from "./index";

describe("rule symmetries", () => {
  it("ecaSymmetryClasses finds the 88 classes of Li & Packard (Complex Systems 4, 1990) covering all 256 rules", () => {
    const classes = ecaSymmetryClasses();
    expect(classes.length).toBe(88);
    expect(classes.flat().sort((a, b) => a - b)).toEqual(Array.from({ length: 256 }, (_, i) => i));
  });

  it("ecaSymmetryImages gives the usual equivalents of rules 110 and 30 (Wolfram, A New Kind of Science, 2002; value from memory)", () => {
    expect(new Set(ecaSymmetryImages(110))).toEqual(new Set([110, 124, 137, 193]));
    expect(new Set(ecaSymmetryImages(30))).toEqual(new Set([30, 86, 135, 149]));
    expect(reflectEca(110)).toBe(124);
    expect(complementEca(110)).toBe(137);
  });

  it("reflectEca and complementEca are commuting involutions", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 255 }), (n) => {
        expect(reflectEca(reflectEca(n))).toBe(n);
        expect(complementEca(complementEca(n))).toBe(n);
        expect(reflectEca(complementEca(n))).toBe(complementEca(reflectEca(n)));
      }),
      { seed: 3, numRuns: 256 },
    );
  });

  it("reflectRule and complementRule conjugate the dynamics: reversing or complementing a word commutes with a step", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2 }),
        fc.integer({ min: 0, max: 2 ** 32 - 1 }),
        fc.array(fc.integer({ min: 0, max: 1 }), { minLength: 5, maxLength: 20 }),
        (radius, n, cells) => {
          const rule = ruleFromNumber(radius, radius === 1 ? n & 255 : n);
          const w = Uint8Array.from(cells);
          const rev = (a: Uint8Array) => Uint8Array.from([...a].reverse());
          const neg = (a: Uint8Array) => a.map((x) => 1 - x);
          expect([...stepWord(reflectRule(rule), rev(w))]).toEqual([...rev(stepWord(rule, w))]);
          expect([...stepWord(complementRule(rule), neg(w))]).toEqual([...neg(stepWord(rule, w))]);
          expect(ruleNumber(reflectRule(reflectRule(rule)))).toBe(ruleNumber(rule));
        },
      ),
      { seed: 5, numRuns: 200 },
    );
  });

  it("reflectEca fixes the left-right symmetric rules such as 90 and 150 and swaps the shifts 170 and 240", () => {
    expect(reflectEca(90)).toBe(90);
    expect(reflectEca(150)).toBe(150);
    expect(reflectEca(170)).toBe(240);
    expect(ecaNumber(complementRule(ecaRule(204)))).toBe(204);
  });
});
