import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { reverseBits, compareStateIndices, rotateToSmallest, transpose32 } from "./index";

const word = fc.integer({ min: 0, max: 0xffffffff });

describe("bits", () => {
  it("transpose32 swaps rows and columns of a 32x32 bit matrix like the element-by-element definition", () => {
    fc.assert(
      fc.property(fc.array(word, { minLength: 32, maxLength: 32 }), (rows) => {
        const a = Uint32Array.from(rows);
        transpose32(a);
        for (let r = 0; r < 32; r++) for (let c = 0; c < 32; c++) expect((a[r]! >>> c) & 1).toBe((rows[c]! >>> r) & 1);
      }),
      { seed: 11, numRuns: 50 },
    );
  });

  it("compareStateIndices orders states exactly as their node-ordered 0/1 text", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 24 }), word, word, (n, x, y) => {
        const a = x % 2 ** n;
        const b = y % 2 ** n;
        const text = (s: number) => Array.from({ length: n }, (_, i) => (s >> i) & 1).join("");
        const expected = text(a) < text(b) ? -1 : text(a) > text(b) ? 1 : 0;
        expect(Math.sign(compareStateIndices(a, b, n))).toBe(expected);
        expect(reverseBits(reverseBits(a, n), n)).toBe(a);
      }),
      { seed: 13 },
    );
  });

  it("rotateToSmallest starts a cycle at its smallest element and keeps the cyclic order", () => {
    expect(rotateToSmallest(["b", "c", "a", "d"], (x, y) => x < y)).toEqual(["a", "d", "b", "c"]);
  });
});
