import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { nkNetwork } from "../../engine/generators";
import { MAX_REPORTED_ERRORS } from "../../engine/rules";
import { parseTruthTableCsv, readTruthTableCsv, writeTruthTableCsv } from "./truth-table-csv";

describe("truth-table CSV", () => {
  it("readTruthTableCsv reads tables in any row order with comments and blank lines", () => {
    const net = readTruthTableCsv(
      "# toy\r\n# node: A\r\nB, A'\r\n1,0\r\n 0 ,1\r\n\r\n# NODE: B\r\n# written by hand\r\nB'\r\n1\r\n",
    );
    expect(net.names).toEqual(["A", "B"]);
    expect(Array.from(net.regulators[0]!)).toEqual([1]);
    expect(Array.from(net.tables[0]!)).toEqual([1, 0]);
    expect(Array.from(net.regulators[1]!)).toEqual([]);
    expect(Array.from(net.tables[1]!)).toEqual([1]);
  });

  it("writeTruthTableCsv counts rows in binary with the first regulator column most significant", () => {
    const net = readTruthTableCsv("# node: A\nA,B,A'\n0,0,0\n0,1,1\n1,0,1\n1,1,1\n# node: B\nB'\n0\n");
    expect(writeTruthTableCsv(net)).toBe(
      "# Emulant truth tables: one table per node; columns are regulators, the last is the next value\n\n# node: A\nA,B,A'\n0,0,0\n0,1,1\n1,0,1\n1,1,1\n\n# node: B\nB'\n0\n",
    );
  });

  it("readTruthTableCsv(writeTruthTableCsv(net)) gives back random NK networks exactly", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 9 }),
        fc.integer({ min: 0, max: 4 }),
        fc.integer({ min: 1, max: 2 ** 31 }),
        (n, k, seed) => {
          const net = nkNetwork({ n, k: Math.min(k, n), p: 0.5, random: seedrandom(String(seed)) });
          expect(readTruthTableCsv(writeTruthTableCsv(net))).toEqual(net);
        },
      ),
      { seed: 4701, numRuns: 150 },
    );
  });

  it("readTruthTableCsv reads the example of docs/truth-table-csv.md", () => {
    const doc = readFileSync(new URL("../../../docs/truth-table-csv.md", import.meta.url), "utf8");
    const net = readTruthTableCsv(/```\n([\s\S]*?)```/.exec(doc)![1]!);
    expect(net.names).toEqual(["Kinase", "Signal", "Phosphatase"]);
    expect(Array.from(net.tables[0]!)).toEqual([0, 1, 0, 0]); // Kinase = Signal & !Phosphatase
  });

  it("parseTruthTableCsv reports every error with its line and column", () => {
    const text = [
      "A,B",
      "# node: A",
      "B,A'",
      "0,1",
      "1,2",
      "0,1",
      "# node: C",
      "C,X'",
      "# node: B",
      "Z,B'",
      "1,1",
      "0,0",
    ].join("\n");
    expect(parseTruthTableCsv(text).errors.map((e) => [e.line, e.column, e.reason])).toEqual([
      // The table of A misses the row B=1 because of its faulty rows; that is not reported a second time.
      [1, 1, "a table must start with a line `# node: NAME`"],
      [5, 3, 'expected 0 or 1, found "2"'],
      [6, 1, "this combination of regulator values was already given on line 4"],
      [8, 3, `the last header cell must be C' (the node's next value), found "X'"`],
      [10, 1, "regulator Z has no table; add a table for Z (e.g. Z' = Z)"],
    ]);
  });

  it("parseTruthTableCsv rejects a second table for a node, short rows and an empty text", () => {
    expect(parseTruthTableCsv("# node: A\nA'\n1\n# node: A\nA'\n0\n").errors[0]!.reason).toBe(
      "node A has a second table (first on line 1)",
    );
    expect(parseTruthTableCsv("# node: A\nA,A'\n1\n").errors.map((e) => e.reason)).toContain(
      "expected 2 cells (1 regulators and A'), found 1",
    );
    expect(parseTruthTableCsv("\n").errors[0]!.reason).toMatch(/no tables/);
  });

  it("parseTruthTableCsv reports lines before the first table once, however many there are", () => {
    const result = parseTruthTableCsv("0,1,0\n".repeat(800_000));
    expect(result.errors.map((e) => [e.line, e.column, e.reason])).toEqual([
      [1, 1, "a table must start with a line `# node: NAME`"],
    ]);
    expect(result.moreErrors).toBe(0);
  });

  it("parseTruthTableCsv lists the first 100 errors and counts the others", () => {
    const result = parseTruthTableCsv("# node: A\nA'\n" + "2\n".repeat(1000));
    expect(result.errors).toHaveLength(MAX_REPORTED_ERRORS);
    // A faulty row leaves its table incomplete; that is not reported a second time as a missing row.
    expect(result.errors[0]!.reason).toBe('expected 0 or 1, found "2"');
    expect(result.moreErrors).toBe(1000 - MAX_REPORTED_ERRORS);
    expect(() => readTruthTableCsv("# node: A\nA'\n" + "2\n".repeat(1000))).toThrow(/\(and 999 more errors\)/);
    expect(parseTruthTableCsv("# node: A\nA'\n").errors[0]!.reason).toBe(
      "the table of A has no row; write its constant next value, 0 or 1",
    );
  });

  it("parseTruthTableCsv refuses a header whose rows the rest of the file cannot hold, before allocating them", () => {
    const regs = "ABCDEFGHIJKLMNOPQRST".split("");
    const header = (name: string) => `# node: ${name}\n${[...regs, `${name}'`].join(",")}`;
    const result = parseTruthTableCsv(Array.from({ length: 5000 }, (_, i) => header(`N${i}`)).join("\n"));
    expect(result.errors[0]!.reason).toMatch(/^the table of N0 needs 1048576 rows; .* at least 44040191 characters/);
    expect(result.errors.length + result.moreErrors).toBe(5000);
    // A table whose rows are all there is read, however the rows are spread out.
    const two = "# node: A\nB,A'\n0,1\n1,0\n# node: B\nB'\n1\n";
    expect(parseTruthTableCsv(two).errors).toEqual([]);
  });

  it("parseTruthTableCsv refuses more than 20 regulators, a name over 256 characters and __proto__, with their place", () => {
    const regs = Array.from({ length: 21 }, (_, i) => `r${i}`);
    expect(parseTruthTableCsv(`# node: A\n${regs.join(",")},A'\n`).errors[0]!.reason).toBe(
      "node A has 21 regulators; at most 20 are supported",
    );
    const long = "N".repeat(257);
    expect(parseTruthTableCsv(`# node: ${long}\n`).errors[0]!.reason).toMatch(
      /^a name of 257 characters \("N{40}…"\); a node name may have at most 256$/,
    );
    expect(parseTruthTableCsv("# node: __proto__\n__proto__'\n1\n").errors.map((e) => [e.line, e.column])).toEqual([
      [1, 9],
    ]);
    expect(parseTruthTableCsv("# node: A\n__proto__,A'\n").errors[0]!.reason).toBe(
      '"__proto__" cannot name a node (JavaScript objects treat it specially)',
    );
  });

  it("parseTruthTableCsv skips a byte order mark and shows control characters escaped", () => {
    expect(parseTruthTableCsv("\uFEFF# node: A\nA'\n1\n").errors).toEqual([]);
    expect(parseTruthTableCsv("# node: A\nA'\n\u0000\n").errors.map((e) => e.reason)).toEqual([
      'expected 0 or 1, found "\\u0000"',
    ]);
  });
});
