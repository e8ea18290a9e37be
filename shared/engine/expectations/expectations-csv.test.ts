import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Assignment, Expectation, ExpectedOutcome } from "./expectation";
import { MAX_CSV_ERRORS, parseExpectationsCsv, readExpectationsCsv, writeExpectationsCsv } from "./expectations-csv";

const HEADER = "id,update,knock_out,over_express,inputs,outcome,pattern,from,count,source,note";

const nameArb: fc.Arbitrary<string> = fc.constantFrom("Cyst", "Lum", "GlfA", "DrmK", "x0", "x_1", "Node12", "a");
const assignmentArb: fc.Arbitrary<Assignment> = fc
  .uniqueArray(fc.tuple(nameArb, fc.constantFrom<0 | 1>(0, 1)), { selector: ([n]) => n, maxLength: 4 })
  .map((entries) => Object.fromEntries(entries));
const nonEmptyAssignmentArb = assignmentArb.filter((a) => Object.keys(a).length > 0);
const comparisonArb = fc.constantFrom("exactly" as const, "at-least" as const, "at-most" as const);
const outcomeArb: fc.Arbitrary<ExpectedOutcome> = fc.oneof(
  fc.record({
    kind: fc.constantFrom("some-attractor" as const, "every-attractor" as const, "no-attractor" as const),
    pattern: nonEmptyAssignmentArb,
  }),
  fc.record({
    kind: fc.constantFrom("fixed-point-count" as const, "attractor-count" as const),
    comparison: comparisonArb,
    count: fc.nat(999),
  }),
  fc.record({ kind: fc.constant("reachable" as const), from: nonEmptyAssignmentArb, pattern: nonEmptyAssignmentArb }),
);
// Free text may hold commas, quotes, line breaks and surrounding spaces; \r is left out because a quoted \r\n
// reads back as \n by design.
const freeTextArb = fc.string({ unit: fc.constantFrom("a", "Z", " ", ",", '"', "\n", "#", ";", "é", "1") });
const expectationArb: fc.Arbitrary<Expectation> = fc
  .record({
    id: fc.stringMatching(/^[A-Za-z0-9][A-Za-z0-9_.-]{0,10}$/),
    update: fc.constantFrom("synchronous" as const, "asynchronous" as const),
    knockOut: fc.uniqueArray(nameArb, { maxLength: 3 }),
    overExpress: fc.uniqueArray(nameArb, { maxLength: 3 }),
    inputs: assignmentArb,
    outcome: outcomeArb,
    source: freeTextArb.filter((s) => s.trim() !== ""),
    note: freeTextArb,
  })
  .filter((r) => !r.knockOut.some((n) => r.overExpress.includes(n)))
  .filter((r) => !Object.keys(r.inputs).some((n) => r.knockOut.includes(n) || r.overExpress.includes(n)))
  .map(({ knockOut, overExpress, inputs, ...rest }) => ({ ...rest, condition: { knockOut, overExpress, inputs } }));

describe("expectations CSV", () => {
  it("readExpectationsCsv(writeExpectationsCsv(table)) gives the table back for any table", () => {
    fc.assert(
      fc.property(fc.uniqueArray(expectationArb, { selector: (e) => e.id, maxLength: 8 }), (table) => {
        expect(readExpectationsCsv(writeExpectationsCsv(table))).toEqual(table);
      }),
      { seed: 1501, numRuns: 300 },
    );
  });

  it("parseExpectationsCsv reads columns in any order, comments, blank lines, CRLF, a byte-order mark and quoted cells", () => {
    const text =
      "\uFEFF# lab table\r\nsource, Outcome ,ID,pattern,knock-out\r\n\r\n" +
      '"Notebook 12, p. 3",some-attractor,e1,"Cyst=1, Lum = 0",GlfA DrmK\r\n# second\r\nLab notebook 4,no-attractor,e2,Cyst=1,\r\n';
    expect(readExpectationsCsv(text)).toEqual([
      {
        id: "e1",
        update: "synchronous",
        condition: { knockOut: ["GlfA", "DrmK"], overExpress: [], inputs: {} },
        outcome: { kind: "some-attractor", pattern: { Cyst: 1, Lum: 0 } },
        source: "Notebook 12, p. 3",
        note: "",
      },
      {
        id: "e2",
        update: "synchronous",
        condition: { knockOut: [], overExpress: [], inputs: {} },
        outcome: { kind: "no-attractor", pattern: { Cyst: 1 } },
        source: "Lab notebook 4",
        note: "",
      },
    ]);
  });

  it("parseExpectationsCsv reads counts written as 2, >=2 and <=2", () => {
    const rows = ["a,fixed-point-count,2,s", "b,attractor-count,>= 3,s", "c,attractor-count,<=1,s"];
    const table = readExpectationsCsv(["id,outcome,count,source", ...rows].join("\n"));
    expect(table.map((e) => e.outcome)).toEqual([
      { kind: "fixed-point-count", comparison: "exactly", count: 2 },
      { kind: "attractor-count", comparison: "at-least", count: 3 },
      { kind: "attractor-count", comparison: "at-most", count: 1 },
    ]);
  });

  it("parseExpectationsCsv reports each error with the line and column of the cell or character at fault", () => {
    const text = [
      HEADER,
      "ok,,,,,some-attractor,A=1,,,src,",
      "bad id,,,,,some-attractor,A=1,,,src,",
      "e3,sometimes,,,,some-attractor,A=2,,,src,",
      "e4,,X,X,,fixed-point-count,,,many,,",
      "e5,,,,,reachable,B=1,,,src,",
      "e6,,,,,attractor-count,A=1,,2,src,",
      "e7,,,,,wobbles,,,,src,",
      "e8,,,,",
      'e9,,,,,some-attractor,"A=1,, 2x=0",,,src,',
      "ok,,,,,attractor-count,,,2,src,",
    ].join("\n");
    const { errors, expectations } = parseExpectationsCsv(text);
    expect(expectations.map((e) => e.id)).toEqual(["ok"]);
    expect(errors.map((e) => [e.line, e.column, e.reason])).toEqual([
      [3, 1, 'id "bad id" must be 1 to 64 letters, digits, "_", "-" or ".", starting with a letter or digit'],
      [4, 4, 'update must be synchronous or asynchronous (empty means synchronous), found "sometimes"'],
      [4, 34, 'expected 0 or 1 for A, found "2"'],
      [5, 7, "X is both knocked out and over-expressed"],
      [5, 30, 'fixed-point-count needs a count such as 2, >=2 or <=2, found "many"'],
      [5, 35, "the source is missing: cite a publication or a lab notebook entry"],
      [6, 22, "reachable needs a start state in from, such as A=1; B=1 (others are 0)"],
      [
        7,
        24,
        "pattern is only used by some-attractor, every-attractor, no-attractor, reachable; leave it empty for attractor-count",
      ],
      [
        8,
        8,
        'unknown outcome "wobbles"; write one of some-attractor, every-attractor, no-attractor, fixed-point-count, attractor-count, reachable',
      ],
      [9, 1, "expected 11 cells as in the header, found 5"],
      // The opening quote is at column 23, so the text "A=1,, 2x=0" starts at 24 and the bad name 6 further on.
      [10, 30, '"2x" is not a valid node name (letters, digits and _, not starting with a digit)'],
      [11, 1, "id ok was already used on line 2"],
    ]);
  });

  it("parseExpectationsCsv reports a missing header column, an unknown column and an unclosed quote", () => {
    expect(parseExpectationsCsv("id,outcome,colour\n").errors.map((e) => [e.line, e.column, e.reason])).toEqual([
      [1, 1, "the header has no source column"],
      [
        1,
        12,
        'unknown column "colour"; the columns are id, update, knock_out, over_express, inputs, outcome, pattern, from, count, source, note',
      ],
    ]);
    expect(parseExpectationsCsv("").errors[0]!.reason).toMatch(/the table is empty/);
    const unclosed = parseExpectationsCsv('id,outcome,pattern,source\ne1,some-attractor,A=1,"Lab book\n');
    expect(unclosed.errors.map((e) => [e.line, e.column, e.reason])).toEqual([
      [2, 23, "this quoted cell is never closed"],
    ]);
  });

  it("parseExpectationsCsv lists at most the first 100 errors and says there were more", () => {
    const rows = Array.from({ length: 150 }, (_, i) => `e${i},,,,,some-attractor,A=7,,,src,`);
    const result = parseExpectationsCsv([HEADER, ...rows].join("\n"));
    expect(result.errors).toHaveLength(MAX_CSV_ERRORS);
    expect(result.truncated).toBe(true);
    expect(result.errors.map((e) => e.line)).toEqual(Array.from({ length: 100 }, (_, i) => i + 2));
    expect(parseExpectationsCsv([HEADER, ...rows.slice(0, 3)].join("\n")).truncated).toBe(false);
  });

  it("readExpectationsCsv reads the example of docs/expectations-csv.md and the yeast fixture", () => {
    const doc = readFileSync(new URL("../../../docs/expectations-csv.md", import.meta.url), "utf8");
    const example = readExpectationsCsv(/```csv\n([\s\S]*?)```/.exec(doc)![1]!);
    expect(example.map((e) => e.outcome.kind)).toEqual([
      "some-attractor",
      "every-attractor",
      "fixed-point-count",
      "reachable",
      "no-attractor",
      "attractor-count",
    ]);
    const yeast = readFileSync(
      new URL("../../../tests/fixtures/expectations/li-2004-yeast-cell-cycle.csv", import.meta.url),
      "utf8",
    );
    expect(readExpectationsCsv(yeast)).toHaveLength(11);
  });
});
