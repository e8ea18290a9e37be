import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { compileDefinition } from "./compile-definition";
import { printRuleText } from "./print-rule-text";
import { readRuleText } from "./parse-rule-text";
import { modelArb } from "./rules-arbitrary.test-support";
import { upgradeDefinition, upgradeExpr, type StoredExpr } from "./stored-definition";
import type { Expr, ModelDefinition } from "./syntax";

/** The form revisions were stored in before: every operator node binary, chains nested to the left. */
function toBinary(e: Expr): StoredExpr {
  switch (e.kind) {
    case "const":
    case "var":
      return e;
    case "not":
      return { kind: "not", arg: toBinary(e.arg) };
    default: {
      const [first, ...rest] = e.args.map(toBinary);
      return rest.reduce<StoredExpr>((left, right) => ({ kind: e.kind, left, right }), first!);
    }
  }
}

const binaryModel = (m: ModelDefinition) => ({
  nodes: m.nodes.map((n) => ({ name: n.name, rule: n.rule.kind === "threshold" ? n.rule : toBinary(n.rule) })),
});

describe("upgradeDefinition", () => {
  it("upgradeDefinition reads a stored binary definition into one that computes the same tables", () => {
    fc.assert(
      fc.property(modelArb(), (model) => {
        expect(compileDefinition(upgradeDefinition(binaryModel(model)))).toEqual(compileDefinition(model));
      }),
      { seed: 5301, numRuns: 200 },
    );
  });

  it("upgradeDefinition gives what parsing the old printed text gives, and leaves current definitions as they are", () => {
    fc.assert(
      fc.property(modelArb(), (model) => {
        // The old printer wrote a left chain without parentheses, so its text parses into the flat chain.
        const upgraded = upgradeDefinition(binaryModel(model));
        expect(readRuleText(printRuleText(upgraded))).toEqual(upgraded);
        expect(upgradeDefinition(model)).toEqual(model);
      }),
      { seed: 5302, numRuns: 200 },
    );
  });

  it("upgradeExpr flattens a stored left chain of 5,000 operands without recursion", () => {
    let e: StoredExpr = { kind: "var", name: "A" };
    for (let i = 1; i < 5000; i++) e = { kind: "and", left: e, right: { kind: "var", name: "B" } };
    const flat = upgradeExpr(e);
    expect(flat.kind === "and" && flat.args.length).toBe(5000);
    let deep: StoredExpr = { kind: "var", name: "A" };
    for (let i = 0; i < 50_000; i++) deep = { kind: "not", arg: deep };
    let x = upgradeExpr(deep);
    let depth = 0;
    while (x.kind === "not") ((x = x.arg), depth++);
    expect(depth).toBe(50_000);
  });
});
