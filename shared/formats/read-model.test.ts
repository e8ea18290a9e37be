import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { ParseError } from "../engine/errors";
import { printRuleText } from "../engine/rules";
import { readModelText } from "./read-model";
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
