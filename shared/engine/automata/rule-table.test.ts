import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { ecaRule, ruleFromNumber, ruleFromTable, ruleNumber, ecaNumber, isAffineRule, isEcaNumber } from "./index";

describe("rule tables", () => {
  it("ecaRule puts bit (4l + 2c + r) of the rule number at table entry 4l + 2c + r (Wolfram numbering, common practice)", () => {
    // rule 110 = 0b01101110: neighbourhoods 111 -> 0, 110 -> 1, 101 -> 1, 100 -> 0, 011 -> 1, 010 -> 1, 001 -> 1, 000 -> 0
    expect([...ecaRule(110).table]).toEqual([0, 1, 1, 1, 0, 1, 1, 0]);
    expect([...ecaRule(30).table]).toEqual([0, 1, 1, 1, 1, 0, 0, 0]);
  });

  it("ecaRule rejects numbers outside 0..255 and non-integers", () => {
    expect(() => ecaRule(256)).toThrow(/0\.\.255/);
    expect(() => ecaRule(-1)).toThrow(/0\.\.255/);
    expect(() => ecaRule(1.5)).toThrow(/0\.\.255/);
    expect(isEcaNumber(255)).toBe(true);
    expect(isEcaNumber("3")).toBe(false);
  });

  it("ruleNumber inverts ruleFromNumber for radius 1 and 2", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 255 }), fc.integer({ min: 0, max: 2 ** 32 - 1 }), (n, m) => {
        expect(ecaNumber(ecaRule(n))).toBe(n);
        expect(ruleNumber(ruleFromNumber(1, n))).toBe(BigInt(n));
        expect(ruleNumber(ruleFromNumber(2, m))).toBe(BigInt(m));
      }),
      { seed: 11, numRuns: 200 },
    );
  });

  it("ruleFromTable checks the length and the entries", () => {
    expect(() => ruleFromTable(1, [0, 1])).toThrow(/8 table entries/);
    expect(() => ruleFromTable(1, [0, 1, 2, 0, 0, 0, 0, 0])).toThrow(/0 or 1/);
    expect(ecaNumber(ruleFromTable(1, [0, 1, 1, 0, 1, 0, 0, 1]))).toBe(150);
  });

  it("isAffineRule finds exactly the 16 elementary rules that are XORs of neighbourhood cells and a constant", () => {
    // from the definition: the 8 subsets of {l, c, r} XORed, with and without complement
    const expected = new Set<number>();
    for (let s = 0; s < 8; s++) {
      for (const c of [0, 1]) {
        let n = 0;
        for (let p = 0; p < 8; p++) {
          let v = c;
          for (let b = 0; b < 3; b++) if ((s >> b) & 1) v ^= (p >> b) & 1;
          n |= v << p;
        }
        expected.add(n);
      }
    }
    const found = Array.from({ length: 256 }, (_, n) => n).filter((n) => isAffineRule(ecaRule(n)));
    expect(found).toEqual([...expected].sort((a, b) => a - b));
    expect(found).toEqual([0, 15, 51, 60, 85, 90, 102, 105, 150, 153, 165, 170, 195, 204, 240, 255]);
  });
});
