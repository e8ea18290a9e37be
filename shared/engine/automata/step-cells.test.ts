import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  ecaRule,
  ruleFromNumber,
  stepWord,
  stepRing,
  stepPackedWord,
  spaceTimeDiagram,
  cellsFromString,
  cellsToString,
  packedFromString,
  packedToString,
} from "./index";

/** The definition, one cell at a time. */
function referenceStep(table: Uint8Array, radius: number, cells: number[]): number[] {
  const out: number[] = [];
  for (let i = radius; i < cells.length - radius; i++) {
    let idx = 0;
    for (let j = -radius; j <= radius; j++) idx = idx * 2 + cells[i + j]!;
    out.push(table[idx]!);
  }
  return out;
}

describe("stepping words and rings", () => {
  it("stepWord matches the cell-by-cell definition and drops r cells at each end", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 3 }),
        fc.bigInt({ min: 0n, max: 2n ** 128n - 1n }),
        fc.array(fc.integer({ min: 0, max: 1 }), { minLength: 7, maxLength: 40 }),
        (radius, n, cells) => {
          const rule = ruleFromNumber(radius, n % (1n << BigInt(1 << (2 * radius + 1))));
          expect([...stepWord(rule, Uint8Array.from(cells))]).toEqual(referenceStep(rule.table, radius, cells));
        },
      ),
      { seed: 7, numRuns: 300 },
    );
  });

  it("stepPackedWord agrees with stepWord on the cells it defines", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2 }),
        fc.integer({ min: 0, max: 2 ** 32 - 1 }),
        fc.integer({ min: 0, max: 2 ** 24 - 1 }),
        (radius, n, word) => {
          const rule = ruleFromNumber(radius, radius === 1 ? n & 255 : n);
          const text = packedToString(word, 24);
          const expected = cellsToString(stepWord(rule, cellsFromString(text)));
          expect(packedToString(stepPackedWord(rule, packedFromString(text)), expected.length)).toBe(expected);
        },
      ),
      { seed: 9, numRuns: 300 },
    );
  });

  it("stepRing of rule 204 is the identity and of rule 170 shifts every cell one place left (next value = right neighbour)", () => {
    const ring = cellsFromString("1101000110");
    expect(cellsToString(stepRing(ecaRule(204), ring))).toBe("1101000110");
    expect(cellsToString(stepRing(ecaRule(170), ring))).toBe("1010001101");
  });

  it("spaceTimeDiagram of rule 90 from one live cell draws Pascal's triangle mod 2 (Wolfram, Rev. Mod. Phys. 55, 1983)", () => {
    const width = 33;
    const initial = new Uint8Array(width);
    initial[16] = 1;
    const d = spaceTimeDiagram(ecaRule(90), initial, 15);
    expect(d.steps).toBe(15);
    for (let s = 0; s <= 15; s++) {
      for (let i = 0; i < width; i++) {
        const off = i - 16 + s;
        // cell 16 - s + 2j holds C(s, j) mod 2, i.e. j is a bit-submask of s (Lucas' theorem)
        const expected = off >= 0 && off % 2 === 0 && off / 2 <= s && ((off / 2) & s) === off / 2 ? 1 : 0;
        expect(d.cells[s * width + i]).toBe(expected);
      }
    }
  });

  it("spaceTimeDiagram keeps every n-th row when asked", () => {
    const initial = cellsFromString("0100110101");
    const all = spaceTimeDiagram(ecaRule(110), initial, 12);
    const sampled = spaceTimeDiagram(ecaRule(110), initial, 12, 3);
    expect(sampled.steps).toBe(4);
    for (let r = 0; r <= 4; r++)
      expect([...sampled.cells.subarray(r * 10, r * 10 + 10)]).toEqual([
        ...all.cells.subarray(3 * r * 10, 3 * r * 10 + 10),
      ]);
    expect(() => spaceTimeDiagram(ecaRule(110), initial, -1)).toThrow(/non-negative/);
  });
});
