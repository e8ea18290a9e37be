import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ParseError } from "../engine/errors";
import { printRuleText } from "../engine/rules";
import { decodeModelText, readModelText } from "./read-model";
import { writeSbmlQual } from "./sbml-qual";
import { writeTruthTableCsv } from "./truth-table-csv";

const rules = readFileSync(new URL("../../tests/fixtures/sbml/faure-2006-cell-cycle.rules", import.meta.url), "utf8");

describe("readModelText", () => {
  it("readModelText picks the reader by extension and gives the same network for all three formats", () => {
    const fromRules = readModelText("cell-cycle.rules", rules);
    const fromSbml = readModelText("cell-cycle.XML", writeSbmlQual(fromRules.definition));
    const fromCsv = readModelText("cell-cycle.csv", writeTruthTableCsv(fromRules.network));
    expect(fromRules.format).toBe("rules");
    expect(fromSbml.format).toBe("sbml");
    expect(fromCsv.format).toBe("csv");
    expect(fromSbml.network).toEqual(fromRules.network);
    expect(fromCsv.network).toEqual(fromRules.network);
    expect(printRuleText(fromSbml.definition)).toBe(printRuleText(fromRules.definition));
  });

  it("readModelText passes on parse errors with their position and refuses unknown extensions", () => {
    expect(() => readModelText("bad.rules", "A' = (B")).toThrow(ParseError);
    expect(() => readModelText("model.json", "{}")).toThrow(/use .sbml or .xml/);
  });
});

describe("decodeModelText", () => {
  const position = (bytes: Uint8Array) => {
    try {
      decodeModelText(bytes);
    } catch (e) {
      if (!(e instanceof ParseError)) throw e;
      return [e.code, e.line, e.column, e.reason];
    }
    return null;
  };

  it("decodeModelText names the line and column of the first byte that is not UTF-8", () => {
    const bytes = Uint8Array.from([...new TextEncoder().encode("A' = B\nB' = é"), 0xc3, 0x28]);
    expect(position(bytes)).toEqual([
      "BAD_ENCODING",
      2,
      7,
      "the file is not UTF-8 text: byte 0xC3 cannot start or continue a character here (save the file as UTF-8)",
    ]);
    expect(position(Uint8Array.from([0xed, 0xa0, 0x80]))?.slice(1, 3)).toEqual([1, 1]); // an encoded surrogate
    expect(position(Uint8Array.from([0x41, 0xf0, 0x9f, 0x98]))?.slice(1, 3)).toEqual([1, 2]); // cut off at the end
  });

  it("decodeModelText drops a byte order mark and keeps NUL bytes for the reader to report", () => {
    expect(decodeModelText(Uint8Array.from([0xef, 0xbb, 0xbf, 0x41, 0x00]))).toBe("A\u0000");
  });

  it("decodeModelText accepts exactly what the WHATWG decoder accepts in fatal mode, and decodes it the same", () => {
    // The reference is the platform's TextDecoder (WHATWG Encoding Standard), not code of this project.
    const fatal = new TextDecoder("utf-8", { fatal: true });
    const byte = fc.oneof(
      fc.integer({ min: 0, max: 255 }),
      fc.constantFrom(0x80, 0xbf, 0xc0, 0xc1, 0xc2, 0xdf, 0xe0, 0xed, 0xef, 0xf0, 0xf4, 0xf5, 0xff, 0x41),
    );
    fc.assert(
      fc.property(fc.array(byte, { maxLength: 24 }), (list) => {
        const bytes = Uint8Array.from(list);
        let expected: string | null;
        try {
          expected = fatal.decode(bytes);
        } catch {
          expected = null;
        }
        if (expected === null) expect(() => decodeModelText(bytes)).toThrow(ParseError);
        else expect(decodeModelText(bytes)).toBe(expected);
      }),
      { seed: 5401, numRuns: 2000 },
    );
  });
});
