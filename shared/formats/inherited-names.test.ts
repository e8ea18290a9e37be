// Node names that are also names of JavaScript's built-in properties (constructor, toString, hasOwnProperty,
// __defineGetter__, length, apply, map...) must behave like any other name in every reader, writer and schema: a
// lookup on a plain object would find the inherited property instead of "not there". `__proto__` is the one name
// that cannot be a key of a plain object at all; every reader refuses it with its own error.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ParseError } from "../engine/errors";
import type { BooleanNetwork } from "../engine/network";
import { compileDefinition, isValidNodeName, parseRuleText, printRuleText } from "../engine/rules";
import { modelArb } from "../engine/rules/rules-arbitrary.test-support";
import { PerturbationBody } from "../schemas/models";
import { readModelText } from "./read-model";
import { readSbmlQual, writeSbmlQual } from "./sbml-qual";
import { parseTruthTableCsv, readTruthTableCsv, writeTruthTableCsv } from "./truth-table-csv";

const BUILT_IN_NAMES = [
  ...new Set(
    [Object.prototype, Function.prototype, Array.prototype, String.prototype, Number.prototype]
      .flatMap((o) => Object.getOwnPropertyNames(o))
      .filter((name) => isValidNodeName(name)),
  ),
];

function nextState(net: BooleanNetwork, s: number): number {
  let t = 0;
  net.names.forEach((_, i) => {
    let row = 0;
    net.regulators[i]!.forEach((r, j) => (row |= ((s >> r) & 1) << j));
    t |= net.tables[i]![row]! << i;
  });
  return t;
}

const readerError = (read: () => unknown): ParseError => {
  try {
    read();
  } catch (e) {
    if (e instanceof ParseError) return e;
    throw e;
  }
  throw new Error("the reader accepted the text");
};

describe("node names that JavaScript objects inherit", () => {
  it("the pool holds the names that plain-object lookups would find", () => {
    for (const name of ["constructor", "toString", "hasOwnProperty", "valueOf", "__defineGetter__", "length", "map"])
      expect(BUILT_IN_NAMES).toContain(name);
    expect(BUILT_IN_NAMES).not.toContain("__proto__");
  });

  it("rule text, truth-table CSV and SBML-qual read, compile and print models named with built-in property names", () => {
    fc.assert(
      fc.property(modelArb(5, BUILT_IN_NAMES), (model) => {
        const text = printRuleText(model);
        const parsed = parseRuleText(text);
        expect(parsed.errors).toEqual([]);
        expect(parsed.definition).toEqual(model);
        const net = compileDefinition(model);
        expect(net.names).toEqual(model.nodes.map((n) => n.name));
        expect(readTruthTableCsv(writeTruthTableCsv(net))).toEqual(net);
        const fromSbml = readSbmlQual(writeSbmlQual(model));
        expect(Object.getPrototypeOf(fromSbml.initialLevels)).toBeNull();
        const back = compileDefinition(fromSbml.definition);
        expect(back.names).toEqual(net.names);
        for (let s = 0; s < 1 << net.names.length; s++) expect(nextState(back, s)).toBe(nextState(net, s));
        expect(readModelText("m.rules", text).network).toEqual(net);
      }),
      { seed: 5501, numRuns: 300 },
    );
  });

  it("a rule that reads an undefined built-in name is reported as undefined, not found on a prototype", () => {
    fc.assert(
      fc.property(fc.constantFrom(...BUILT_IN_NAMES), (name) => {
        const { errors } = parseRuleText(`A' = ${name}\n`);
        expect(errors.map((e) => e.reason)).toEqual([
          `node ${name} is used on line 1 but has no rule; add \`${name}' = ${name}\` to make it an input`,
        ]);
        expect(parseTruthTableCsv(`# node: A\n${name},A'\n0,0\n1,1\n`).errors.map((e) => e.reason)).toEqual([
          `regulator ${name} has no table; add a table for ${name} (e.g. ${name}' = ${name})`,
        ]);
      }),
      { seed: 5502, numRuns: 100 },
    );
  });

  it("every reader refuses __proto__ as a node name with its own ParseError, and the schemas refuse it as a key", () => {
    expect(readerError(() => readModelText("m.rules", "__proto__' = 1\n")).column).toBe(1);
    expect(readerError(() => readModelText("m.rules", "A' = __proto__\n")).column).toBe(6);
    expect(readerError(() => readModelText("m.csv", "# node: __proto__\n__proto__'\n1\n")).line).toBe(1);
    const sbml = writeSbmlQual({ nodes: [{ name: "P", rule: { kind: "var", name: "P" } }] }).replace(
      /"P"/g,
      '"__proto__"',
    );
    expect(readerError(() => readModelText("m.sbml", sbml)).reason).toBe("species id __proto__ cannot be a node name");
    const body = PerturbationBody.safeParse(JSON.parse('{"fixed": {"__proto__": 1, "constructor": 0}}'));
    expect(body.success).toBe(false);
    const fine = PerturbationBody.parse(JSON.parse('{"fixed": {"constructor": 0, "toString": 1}}'));
    expect(Object.entries(fine.fixed)).toEqual([
      ["constructor", 0],
      ["toString", 1],
    ]);
  });
});
