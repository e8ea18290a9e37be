import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { ecaRule, ruleFromNumber, reflectEca, complementEca, isAffineRule } from "../automata";
import { blockEmulations, naiveEmulations, verifyEmulation, middleBlockMap } from "./index";
import { mergeSliceEmulations, triangularSliceStart } from "./block-emulations";

const targets = (list: { target: number }[]) => list.map((e) => e.target);

describe("blockEmulations", () => {
  it("blockEmulations sliced into parts gives, merged lowest slice first, the whole search's targets, witnesses and pair count", () => {
    const check = (f: number, k: number, parts: number) => {
      const rule = ecaRule(f);
      const whole = blockEmulations(rule, k);
      const slices = Array.from({ length: parts }, (_, part) => blockEmulations(rule, k, k, { part, parts }));
      expect(mergeSliceEmulations(slices.map((x) => x.emulations)), `rule ${f}, k ${k}, ${parts} parts`).toEqual(
        whole.emulations,
      );
      expect(slices.reduce((sum, x) => sum + x.pairsExamined, 0)).toBe(whole.pairsExamined);
    };
    // rules 154 and 76 have hundreds of fixed words at k = 10 and take the bucketed pairing; 204 is affine
    for (const f of [154, 76]) {
      const map = middleBlockMap(ecaRule(f), 10, 10);
      let fixed = 0;
      for (let x = 0; x < 1024; x++) if (map.middle(x, x, x) === x) fixed++;
      expect(fixed).toBeGreaterThan(200);
    }
    for (const f of [154, 76, 204]) check(f, 10, 4);
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 255 }),
        fc.integer({ min: 2, max: 9 }),
        fc.integer({ min: 1, max: 7 }),
        check,
      ),
      { numRuns: 120, seed: 12 },
    );
    expect(() => blockEmulations(ecaRule(30), 4, 4, { part: 3, parts: 3 })).toThrow(/slice 3 of 3/);
  });

  it("triangularSliceStart cuts a triangle of pairs into slices of near-equal area covering every index once", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 100000 }), fc.integer({ min: 1, max: 64 }), (n, parts) => {
        const starts = Array.from({ length: parts + 1 }, (_, p) => triangularSliceStart(n, p, parts));
        expect(starts[0]).toBe(0);
        expect(starts[parts]).toBe(n);
        for (let p = 0; p < parts; p++) expect(starts[p + 1]!).toBeGreaterThanOrEqual(starts[p]!);
        // pairs of index i: n - 1 - i; each slice within n pairs-rows of the ideal share
        const area = (a: number, b: number) => ((b - a) * (2 * n - 1 - a - b + 1)) / 2;
        const ideal = (n * (n - 1)) / 2 / parts;
        for (let p = 0; p < parts; p++)
          expect(Math.abs(area(starts[p]!, starts[p + 1]!) - ideal)).toBeLessThanOrEqual(n + 1);
      }),
      { numRuns: 300 },
    );
  });

  it("blockEmulations finds the same targets as the all-pairs reference for every elementary rule and k <= 6 (t = k), with valid witnesses", () => {
    for (let f = 0; f < 256; f++) {
      for (let k = 1; k <= 6; k++) {
        const rule = ecaRule(f);
        const fast = blockEmulations(rule, k);
        expect(targets(fast.emulations), `rule ${f}, k ${k}`).toEqual(targets(naiveEmulations(rule, k).emulations));
        for (const e of fast.emulations)
          expect(verifyEmulation(rule, e.target, e.u0, e.u1).valid, `rule ${f} -> ${e.target} at k ${k}`).toBe(true);
      }
    }
  });

  it("blockEmulations agrees with the reference for shorter time scales t < k", () => {
    for (const [k, t] of [
      [3, 1],
      [4, 2],
      [5, 3],
      [6, 4],
    ] as const) {
      for (let f = 0; f < 256; f += k >= 5 ? 3 : 1) {
        const rule = ecaRule(f);
        const fast = blockEmulations(rule, k, t);
        expect(targets(fast.emulations), `rule ${f}, k ${k}, t ${t}`).toEqual(
          targets(naiveEmulations(rule, k, t).emulations),
        );
        for (const e of fast.emulations) expect(verifyEmulation(rule, e.target, e.u0, e.u1, t).valid).toBe(true);
      }
    }
  });

  it("blockEmulations agrees with the reference for random radius-2 emulators", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 2 ** 32 - 1 }),
        fc.constantFrom([2, 1], [3, 1], [4, 1], [4, 2], [5, 2]),
        (n, [k, t]) => {
          const rule = ruleFromNumber(2, n);
          const fast = blockEmulations(rule, k, t);
          expect(targets(fast.emulations)).toEqual(targets(naiveEmulations(rule, k, t).emulations));
          for (const e of fast.emulations) expect(verifyEmulation(rule, e.target, e.u0, e.u1, t).valid).toBe(true);
        },
      ),
      { seed: 17, numRuns: 60 },
    );
  });

  it("blockEmulations is equivariant: reflecting F reflects its targets, complementing F keeps them, and the set is closed under complement conjugation", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 255 }), fc.integer({ min: 1, max: 8 }), (f, k) => {
        const base = targets(blockEmulations(ecaRule(f), k).emulations);
        const reflected = targets(blockEmulations(ecaRule(reflectEca(f)), k).emulations);
        const complemented = targets(blockEmulations(ecaRule(complementEca(f)), k).emulations);
        const sorted = (a: number[]) => [...a].sort((p, q) => p - q);
        expect(reflected).toEqual(sorted(base.map(reflectEca)));
        expect(complemented).toEqual(base);
        expect(sorted(base.map(complementEca))).toEqual(base);
      }),
      { seed: 23, numRuns: 80 },
    );
  });

  it("blockEmulations at k = 1 gives exactly F and its complement conjugate, since u0, u1 are the two states", () => {
    for (let f = 0; f < 256; f++) {
      expect(targets(blockEmulations(ecaRule(f), 1).emulations)).toEqual(
        [...new Set([f, complementEca(f)])].sort((a, b) => a - b),
      );
    }
  });

  it("blockEmulations of the identity rule 204 gives only 204 at every block size, since its block map returns the middle word", () => {
    for (let k = 1; k <= 12; k++) expect(targets(blockEmulations(ecaRule(204), k).emulations)).toEqual([204]);
  });

  it("blockEmulations of rule 0 gives exactly the constant rules 0 and 255, since every block is mapped to 0...0", () => {
    for (let k = 1; k <= 12; k++) {
      const res = blockEmulations(ecaRule(0), k);
      expect(targets(res.emulations)).toEqual([0, 255]);
      expect(res.emulations[0]!.u0).toBe("0".repeat(k));
    }
  });

  it("blockEmulations of the complement rule 51 gives 204 at even k and 51 at odd k, as 51 applied k times is the identity or the complement", () => {
    for (let k = 1; k <= 10; k++) {
      const res = blockEmulations(ecaRule(51), k);
      expect(res.method).toBe("affine");
      expect(targets(res.emulations)).toEqual([k % 2 === 0 ? 204 : 51]);
    }
  });

  it("blockEmulations of an affine rule finds only affine targets, through linear algebra", () => {
    for (const f of [60, 90, 102, 150, 105, 165]) {
      for (let k = 2; k <= 10; k++) {
        const res = blockEmulations(ecaRule(f), k);
        expect(res.pairsExamined).toBe(0);
        for (const e of res.emulations) {
          expect(isAffineRule(ecaRule(e.target))).toBe(true);
          expect(verifyEmulation(ecaRule(f), e.target, e.u0, e.u1).valid).toBe(true);
        }
      }
    }
  });

  it("blockEmulations reports a stop request as a CancelledError", () => {
    expect(() => blockEmulations(ecaRule(42), 10, 10, { shouldStop: () => true })).toThrow(/cancelled/);
  });
});
