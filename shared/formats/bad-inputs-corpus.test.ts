// Runs every case of the bad-input corpus (tests/fixtures/bad-inputs) through the readers an upload goes through:
// decodeModelText on the bytes, then readModelText by the file's extension. Each must give exactly the answer the
// manifest records; nothing may throw anything but a ParseError.
import { describe, expect, it } from "vitest";
import { loadBadInputs } from "../../tests/fixtures/bad-inputs/corpus";
import { ParseError } from "../engine/errors";
import { parseRuleText } from "../engine/rules";
import { decodeModelText, readModelText } from "./read-model";
import { parseTruthTableCsv } from "./truth-table-csv";

const cases = loadBadInputs();

function answer(fileName: string, bytes: Uint8Array) {
  try {
    const read = readModelText(fileName, decodeModelText(bytes));
    return { accepted: true as const, nodeCount: read.network.names.length };
  } catch (e) {
    if (!(e instanceof ParseError)) throw e;
    return { accepted: false as const, error: e };
  }
}

describe("the bad-input corpus", () => {
  it("the corpus covers every upload format with dozens of cases", () => {
    const formats = new Map<string, number>();
    for (const c of cases) formats.set(c.format, (formats.get(c.format) ?? 0) + 1);
    for (const format of ["rules", "sbml", "csv"]) expect(formats.get(format)).toBeGreaterThanOrEqual(20);
    expect(new Set(cases.map((c) => c.id)).size).toBe(cases.length);
  });

  it.each(cases.map((c) => [c.id, c.description, c] as const))(
    "readModelText answers %s (%s) as the manifest says",
    (_id, _description, c) => {
      const got = answer(c.fileName, c.bytes);
      if (c.expect.accepted) {
        expect(got).toEqual({ accepted: true, nodeCount: c.expect.nodeCount });
        return;
      }
      expect(got.accepted).toBe(false);
      const e = (got as { error: ParseError }).error;
      expect({ code: e.code, line: e.line, column: e.column }).toEqual({
        code: c.expect.code,
        line: c.expect.line,
        column: c.expect.column,
      });
      expect(e.reason).toContain(c.expect.message);
      if (c.expect.errorCount !== undefined) {
        const text = decodeModelText(c.bytes);
        const all = c.format === "rules" ? parseRuleText(text) : parseTruthTableCsv(text);
        expect(all.errors.length).toBeLessThanOrEqual(100);
        expect(all.errors.length + all.moreErrors).toBe(c.expect.errorCount);
        expect([all.errors[0]!.line, all.errors[0]!.column]).toEqual([e.line, e.column]);
      }
    },
  );
});
