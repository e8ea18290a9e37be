import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { ruleFromNumber, stepWord, packedToString, cellsFromString, cellsToString } from "../automata";
import { middleBlockMap } from "./index";

describe("middleBlockMap", () => {
  it("middle returns the middle k cells after t plain steps on x y z, for radius 1 to 4 and every admissible t, up to the largest block", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 4 }),
        fc.bigInt({ min: 0n, max: 2n ** 512n - 1n }),
        fc.integer({ min: 1, max: 20 }),
        fc.integer({ min: 0, max: 2 ** 20 - 1 }),
        fc.integer({ min: 0, max: 2 ** 20 - 1 }),
        fc.integer({ min: 0, max: 2 ** 20 - 1 }),
        fc.integer({ min: 1, max: 20 }),
        (radius, n, kRaw, x, y, z, tRaw) => {
          const k = Math.max(kRaw, radius);
          const t = 1 + (tRaw % Math.floor(k / radius));
          const rule = ruleFromNumber(radius, n % (1n << BigInt(1 << (2 * radius + 1))));
          const mask = (1 << k) - 1;
          const [a, b, c] = [x & mask, y & mask, z & mask];
          let cells = cellsFromString(packedToString(a, k) + packedToString(b, k) + packedToString(c, k));
          for (let s = 0; s < t; s++) cells = stepWord(rule, cells);
          const start = k - radius * t;
          expect(packedToString(middleBlockMap(rule, k, t).middle(a, b, c), k)).toBe(
            cellsToString(cells.subarray(start, start + k)),
          );
        },
      ),
      { seed: 21, numRuns: 400 },
    );
  });

  it("middleBlockMap rejects a time that lets information cross more than one block", () => {
    expect(() => middleBlockMap(ruleFromNumber(2, 7), 5, 3)).toThrow(/exceeds the block size/);
    expect(() => middleBlockMap(ruleFromNumber(1, 7), 4, 5)).toThrow(/1\.\.block/);
    expect(() => middleBlockMap(ruleFromNumber(1, 7), 0, 1)).toThrow(/block size/);
  });
});
