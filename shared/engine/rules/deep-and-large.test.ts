// Every stage of the rules folder on trees far deeper or larger than any model: each either works or refuses with
// its own error (ParseError with line and column when there is text), never with a RangeError from the call stack.
import { describe, expect, it } from "vitest";
import { EngineError, ParseError } from "../errors";
import { checkDefinition, compileDefinition, truthTableOf } from "./compile-definition";
import { MAX_NESTING_DEPTH } from "./limits";
import { networkToDefinition, tableToExpr } from "./network-to-definition";
import { parseRuleText, readRuleText } from "./parse-rule-text";
import { printExpr, printRuleText } from "./print-rule-text";
import { firstTooDeep, stripPositions, variablesOf, type Expr } from "./syntax";
import { tokenizeLine } from "./tokenizer";

const engineCode = (f: () => unknown): string => {
  try {
    f();
  } catch (e) {
    if (e instanceof EngineError) return e.code;
    throw e;
  }
  return "no error";
};

describe("rules at depth and scale", () => {
  it("a rule nested 100,000 levels deep prints, and every stage that would recurse refuses it by its code", () => {
    let deep: Expr = { kind: "var", name: "A" };
    for (let i = 0; i < 100_000; i++)
      deep = { kind: "not", arg: i % 2 ? deep : { kind: "and", args: [deep, { kind: "var", name: "A" }] } };
    const model = { nodes: [{ name: "A", rule: deep }] };
    expect(variablesOf(deep)).toEqual(["A"]);
    // (toEqual itself recurses, so the copy is compared through its printed text)
    expect(printExpr(stripPositions(deep) as Expr)).toBe(printExpr(deep));
    expect(firstTooDeep(deep, MAX_NESTING_DEPTH)).not.toBeNull();
    const text = printRuleText(model);
    expect(text.length).toBeGreaterThan(300_000);
    const parsed = parseRuleText(text);
    expect(parsed.errors[0]).toBeInstanceOf(ParseError);
    expect([parsed.errors[0]!.code, parsed.errors[0]!.line]).toEqual(["TOO_DEEP", 1]);
    expect(engineCode(() => checkDefinition(model))).toBe("TOO_DEEP");
    expect(engineCode(() => compileDefinition(model))).toBe("TOO_DEEP");
    expect(engineCode(() => truthTableOf(deep, ["A"]))).toBe("TOO_DEEP");
  });

  it("a rule exactly 500 levels deep compiles, prints, reads back and survives JSON", () => {
    let e: Expr = { kind: "var", name: "A" };
    for (let i = 0; i < MAX_NESTING_DEPTH; i++) e = { kind: "not", arg: e };
    const model = { nodes: [{ name: "A", rule: e }] };
    expect(Array.from(compileDefinition(model).tables[0]!)).toEqual([0, 1]);
    expect(readRuleText(printRuleText(model))).toEqual(model);
    expect(JSON.parse(JSON.stringify(model))).toEqual(model);
  });

  it("tokenizeLine reads a line of a million characters", () => {
    const result = tokenizeLine("A & ".repeat(250_000) + "A");
    expect(result.ok && result.tokens.length).toBe(500_002);
  });

  it("networkToDefinition writes the 14-input parity as a flat sum of 8,192 products that compiles back to its table", () => {
    // common practice: parity has no two adjacent ones, so its minimal sum of products lists every one of its 2^(k-1)
    // minterms
    const k = 14;
    const names = Array.from({ length: k }, (_, i) => `g${i}`);
    const table = Uint8Array.from({ length: 1 << k }, (_, row) => {
      let p = 0;
      for (let x = row; x; x &= x - 1) p ^= 1;
      return p;
    });
    const expr = tableToExpr(table, names);
    expect(expr.kind === "or" && expr.args.length).toBe(1 << (k - 1));
    expect(firstTooDeep(expr, 3)).toBeNull();
    const net = compileDefinition({
      nodes: [...names.map((name) => ({ name, rule: { kind: "var" as const, name } })), { name: "P", rule: expr }],
    });
    expect(net.tables[k]).toEqual(table);
    const back = networkToDefinition(net);
    expect(JSON.parse(JSON.stringify(back))).toEqual(back);
    expect(printExpr(back.nodes[k]!.rule as Expr).split(" | ")).toHaveLength(1 << (k - 1));
  });
});
