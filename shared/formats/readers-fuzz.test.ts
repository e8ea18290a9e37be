// Fuzzing of the three model readers with seeded fast-check: token soups, mutations of valid files and deep nesting.
// Whatever the text, a reader returns or throws its own error type (EngineError, of which ParseError is one), each
// error has a real position, and the answer comes within a generous time bound: a hang detector, not a speed test
// (speed is measured by benchmarks).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { EngineError, ParseError } from "../engine/errors";
import { nkNetwork } from "../engine/generators";
import { MAX_REPORTED_ERRORS, compileDefinition, parseRuleText, printRuleText } from "../engine/rules";
import { modelArb } from "../engine/rules/rules-arbitrary.test-support";
import { readModelText } from "./read-model";
import { readSbmlQual, writeSbmlQual } from "./sbml-qual";
import { parseTruthTableCsv, writeTruthTableCsv } from "./truth-table-csv";

/** Far above any answer seen (milliseconds, on a loaded two-core machine); only a reader that hangs exceeds it. */
const HANG_MS = 5000;

const ODD_CHARACTERS = ["\u0000", "\u0007", "\r", "\t", "\uFEFF", "\uD800", "\uDC00", "\u202E", "\u{1F600}", "é", "$"];
const oddCharacter = fc.constantFrom(...ODD_CHARACTERS);

/** The reader's outcome: returned, or threw an EngineError. Anything else thrown fails the property. */
function within(read: () => unknown): void {
  const started = performance.now();
  try {
    read();
  } catch (e) {
    if (!(e instanceof EngineError)) throw e;
    if (e instanceof ParseError) {
      expect(Number.isInteger(e.line) && e.line >= 1).toBe(true);
      expect(Number.isInteger(e.column) && e.column >= 1).toBe(true);
    }
  }
  expect(performance.now() - started).toBeLessThan(HANG_MS);
}

function checkErrors(errors: readonly ParseError[]): void {
  expect(errors.length).toBeLessThanOrEqual(MAX_REPORTED_ERRORS);
  for (const e of errors) {
    expect(e).toBeInstanceOf(ParseError);
    expect(e.line >= 1 && e.column >= 1).toBe(true);
  }
}

/** A text with a few of its characters replaced, deleted or duplicated, and odd characters inserted. */
function mutated(base: fc.Arbitrary<string>): fc.Arbitrary<string> {
  const edit = fc.record({
    at: fc.double({ min: 0, max: 1, noNaN: true }),
    length: fc.integer({ min: 0, max: 40 }),
    kind: fc.constantFrom("delete", "duplicate", "insert", "truncate"),
    insert: fc.oneof(
      oddCharacter,
      fc.string({ unit: "binary", maxLength: 6 }),
      fc.constantFrom("(", ")", "<", ">", "&", ",", "'", "\n"),
    ),
  });
  return fc.tuple(base, fc.array(edit, { minLength: 1, maxLength: 5 })).map(([text, edits]) =>
    edits.reduce((t, e) => {
      const i = Math.floor(e.at * t.length);
      switch (e.kind) {
        case "delete":
          return t.slice(0, i) + t.slice(i + e.length);
        case "duplicate":
          return t.slice(0, i + e.length) + t.slice(i, i + e.length) + t.slice(i + e.length);
        case "insert":
          return t.slice(0, i) + e.insert + t.slice(i);
        default:
          return t.slice(0, i);
      }
    }, text),
  );
}

const RULE_TOKENS = [
  "A",
  "B",
  "Kinase",
  "constructor",
  "toString",
  "__proto__",
  "and",
  "OR",
  "not",
  "xor",
  "threshold",
  "0",
  "1",
  "2",
  "99999999999999999999",
  "'",
  "=",
  "&",
  "|",
  "^",
  "!",
  "(",
  ")",
  ",",
  ";",
  "+",
  "-",
  "offset",
  "tie",
  "keep",
  "zero",
  "#",
  " ",
  "\n",
  "A' = ",
  "B' = B\n",
];
const ruleSoup = fc
  .array(fc.oneof({ weight: 8, arbitrary: fc.constantFrom(...RULE_TOKENS) }, { weight: 1, arbitrary: oddCharacter }), {
    maxLength: 80,
  })
  .map((tokens) => tokens.join(""));
const deepRule = fc
  .tuple(fc.integer({ min: 0, max: 3000 }), fc.constantFrom("(", "!", "A | B & (", "not "), fc.boolean())
  .map(([depth, open, closed]) => `A' = ${open.repeat(depth)}A${closed ? ")".repeat(depth) : ""}\nB' = B\n`);

const CSV_TOKENS = [
  "# node: ",
  "A",
  "B",
  "__proto__",
  "constructor",
  "A'",
  "B'",
  ",",
  "0",
  "1",
  "2",
  "\n",
  "\r\n",
  " ",
  "#",
];
const csvSoup = fc
  .array(fc.oneof({ weight: 8, arbitrary: fc.constantFrom(...CSV_TOKENS) }, { weight: 1, arbitrary: oddCharacter }), {
    maxLength: 80,
  })
  .map((tokens) => tokens.join(""));
const writtenCsv = fc
  .tuple(fc.integer({ min: 1, max: 6 }), fc.integer({ min: 0, max: 3 }), fc.integer({ min: 1, max: 2 ** 31 }))
  .map(([n, k, seed]) =>
    writeTruthTableCsv(nkNetwork({ n, k: Math.min(k, n), p: 0.5, random: seedrandom(String(seed)) })),
  );

const XML_TOKENS = [
  '<sbml level="3">',
  "</sbml>",
  "<model>",
  "</model>",
  "<listOfQualitativeSpecies>",
  "</listOfQualitativeSpecies>",
  '<qualitativeSpecies id="A" maxLevel="1"/>',
  '<qualitativeSpecies id="constructor"/>',
  "<listOfTransitions>",
  "</listOfTransitions>",
  "<transition>",
  "</transition>",
  '<output qualitativeSpecies="A"/>',
  "<listOfFunctionTerms>",
  '<defaultTerm resultLevel="0"/>',
  '<functionTerm resultLevel="1">',
  "</functionTerm>",
  "<math>",
  "</math>",
  "<apply>",
  "</apply>",
  "<not/>",
  "<and/>",
  "<eq/>",
  "<ci>A</ci>",
  "<cn>1</cn>",
  "<true/>",
  "<!--",
  "-->",
  "<![CDATA[",
  "]]>",
  '<?xml version="1.0"?>',
  "&amp;",
  "&#0;",
  "&foo;",
  "<!DOCTYPE x>",
  "<",
  ">",
  '"',
  "=",
  " ",
  "\n",
];
const xmlSoup = fc
  .array(fc.oneof({ weight: 8, arbitrary: fc.constantFrom(...XML_TOKENS) }, { weight: 1, arbitrary: oddCharacter }), {
    maxLength: 60,
  })
  .map((tokens) => tokens.join(""));
const writtenSbml = modelArb(4).map((m) => writeSbmlQual(m));
const deepXml = fc
  .tuple(fc.integer({ min: 0, max: 3000 }), fc.boolean())
  .map(
    ([depth, closed]) =>
      `<sbml level="3"><model><listOfQualitativeSpecies><qualitativeSpecies id="A"/></listOfQualitativeSpecies><listOfTransitions><transition><listOfOutputs><output qualitativeSpecies="A"/></listOfOutputs><listOfFunctionTerms><defaultTerm resultLevel="0"/><functionTerm resultLevel="1"><math>${"<apply><not/>".repeat(depth)}<true/>${closed ? "</apply>".repeat(depth) : ""}</math></functionTerm></listOfFunctionTerms></transition></listOfTransitions></model></sbml>`,
  );

describe("reader fuzzing", () => {
  it("parseRuleText, readModelText and compileDefinition answer any rule text with their own errors, in time", () => {
    const text = fc.oneof(ruleSoup, mutated(modelArb(5).map(printRuleText)), deepRule);
    fc.assert(
      fc.property(text, (t) => {
        within(() => {
          const result = parseRuleText(t);
          checkErrors(result.errors);
          if (result.definition) {
            JSON.stringify(result.definition);
            compileDefinition(result.definition);
          }
        });
        within(() => readModelText("fuzz.rules", t));
      }),
      { seed: 5601, numRuns: 600 },
    );
  });

  it("parseTruthTableCsv and readModelText answer any CSV text with their own errors, in time", () => {
    const text = fc.oneof(csvSoup, mutated(writtenCsv));
    fc.assert(
      fc.property(text, (t) => {
        within(() => checkErrors(parseTruthTableCsv(t).errors));
        within(() => readModelText("fuzz.csv", t));
      }),
      { seed: 5602, numRuns: 600 },
    );
  });

  it("readSbmlQual and readModelText answer any XML text with their own errors, in time", () => {
    const text = fc.oneof(xmlSoup, mutated(writtenSbml), deepXml);
    fc.assert(
      fc.property(text, (t) => {
        within(() => readSbmlQual(t));
        within(() => readModelText("fuzz.sbml", t));
      }),
      { seed: 5603, numRuns: 400 },
    );
  });
});
