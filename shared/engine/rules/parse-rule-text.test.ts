import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ParseError } from "../errors";
import { parseRuleText, readRuleText } from "./parse-rule-text";
import { compileDefinition } from "./compile-definition";
import { printRuleText } from "./print-rule-text";
import { modelArb } from "./rules-arbitrary.test-support";
import type { Expr } from "./syntax";

const v = (name: string): Expr => ({ kind: "var", name });
const rhs = (expr: string): Expr => {
  const def = readRuleText(`X' = ${expr}\nA' = A\nB' = B\nC' = C\n`);
  return def.nodes[0]!.rule as Expr;
};

describe("parseRuleText", () => {
  it("readRuleText reads a small model with comments, blank lines and both operator spellings", () => {
    const text = "# toy switch\n\nA' = !B   # repressed by B\nB' = not A AND C\nC' = C\n";
    expect(readRuleText(text)).toEqual({
      nodes: [
        { name: "A", rule: { kind: "not", arg: v("B") } },
        { name: "B", rule: { kind: "and", args: [{ kind: "not", arg: v("A") }, v("C")] } },
        { name: "C", rule: v("C") },
      ],
    });
  });

  it("readRuleText binds not tighter than and, and tighter than xor, and xor tighter than or", () => {
    expect(rhs("A | B & C")).toEqual({ kind: "or", args: [v("A"), { kind: "and", args: [v("B"), v("C")] }] });
    expect(rhs("A ^ B | C")).toEqual({ kind: "or", args: [{ kind: "xor", args: [v("A"), v("B")] }, v("C")] });
    expect(rhs("A & B ^ C")).toEqual({ kind: "xor", args: [{ kind: "and", args: [v("A"), v("B")] }, v("C")] });
    expect(rhs("!A & B")).toEqual({ kind: "and", args: [{ kind: "not", arg: v("A") }, v("B")] });
    expect(rhs("A xor b or C".replace("b", "B"))).toEqual(rhs("(A ^ B) | C"));
  });

  it("readRuleText keeps a chain of one operator as one node and a parenthesised chain as its own", () => {
    expect(rhs("A & B & C")).toEqual({ kind: "and", args: [v("A"), v("B"), v("C")] });
    expect(rhs("(A & B) & C")).toEqual({ kind: "and", args: [{ kind: "and", args: [v("A"), v("B")] }, v("C")] });
    expect(rhs("A & (B & C)")).toEqual({ kind: "and", args: [v("A"), { kind: "and", args: [v("B"), v("C")] }] });
    expect(rhs("((A))")).toEqual(v("A"));
    expect(rhs("A Or NOT b".replace("b", "B"))).toEqual({ kind: "or", args: [v("A"), { kind: "not", arg: v("B") }] });
    expect(rhs("1 & (0 | A)")).toEqual({
      kind: "and",
      args: [
        { kind: "const", value: 1 },
        { kind: "or", args: [{ kind: "const", value: 0 }, v("A")] },
      ],
    });
  });

  it("readRuleText reads threshold rules with signed integer weights, offset and tie behaviour", () => {
    const def = readRuleText(
      "Cdh1' = threshold(+1 Cdc14, -1 Clb2, -2 Clb5; offset -1; tie zero)\nCdc14' = Cdc14\nClb2' = Clb2\nClb5' = Clb5\nS' = THRESHOLD(1 Cdc14)\n",
    );
    expect(def.nodes[0]!.rule).toEqual({
      kind: "threshold",
      terms: [
        { weight: 1, node: "Cdc14" },
        { weight: -1, node: "Clb2" },
        { weight: -2, node: "Clb5" },
      ],
      offset: -1,
      tie: "zero",
    });
    expect(def.nodes[4]!.rule).toEqual({
      kind: "threshold",
      terms: [{ weight: 1, node: "Cdc14" }],
      offset: 0,
      tie: "keep",
    });
  });

  it("parseRuleText reports every faulty line with its line, column and reason", () => {
    const text = ["A' = B &", "B = A", "C' = (A | B", "D' = A $ B", "E' = 2", "A' = 1", "F' = G"].join("\n");
    const { errors, definition } = parseRuleText(text);
    expect(definition).toBeNull();
    expect(errors.map((e) => [e.line, e.column, e.reason])).toEqual([
      [1, 9, 'expected a node name, 0, 1, "not" or "(", found end of line'],
      [2, 3, "missing prime after B; write B' = ..."],
      [3, 12, 'missing ")" to close "(" at column 6'],
      [4, 8, 'unknown character "$"'],
      [5, 6, "constant 2 is not Boolean; use 0 or 1"],
      [6, 1, "duplicate rule for A (first on line 1)"],
      [7, 6, "node G is used on line 7 but has no rule; add `G' = G` to make it an input"],
    ]);
    expect(errors.every((e) => e instanceof ParseError)).toBe(true);
  });

  it("parseRuleText explains threshold mistakes", () => {
    const reasons = (line: string) => parseRuleText(`${line}\nA' = A\nB' = B`).errors.map((e) => e.reason);
    expect(reasons("X' = threshold(+1 A, A)")).toEqual(["write a weight before A, e.g. +1 A"]);
    expect(reasons("X' = threshold(+1 A, 0 B)")).toEqual(["weight 0 has no effect; remove the term for B"]);
    expect(reasons("X' = threshold(+1 A, -1 A)")).toEqual(["A already has a weight (column 19)"]);
    expect(reasons("X' = threshold(+1 A; tie hold)")).toEqual(['tie must be keep or zero, found "hold"']);
    expect(reasons("X' = threshold(+1 A; bias 2)")).toEqual(['unknown threshold option "bias"; use offset or tie']);
    expect(reasons("X' = threshold(+1 A")).toEqual(['missing ")" to close threshold(']);
    expect(reasons("X' = A & threshold(+1 B)")).toEqual(["threshold(...) must be the whole right side of a rule"]);
  });

  it("parseRuleText rejects reserved words as names, stray closing parentheses and empty texts", () => {
    expect(parseRuleText("Or' = 1").errors[0]!.reason).toBe('"Or" is a reserved word and cannot name a node');
    expect(parseRuleText("A' = A)").errors[0]!.reason).toBe('unmatched ")"');
    expect(parseRuleText("# nothing here\n\n").errors[0]!.reason).toMatch(/no rules/);
    expect(parseRuleText("3A' = 1").errors[0]!.reason).toMatch(/cannot start with a digit/);
  });

  it("parseRuleText refuses nesting deeper than 500 levels instead of exhausting the stack", () => {
    expect(parseRuleText(`A' = ${"(".repeat(100_000)}A${")".repeat(100_000)}`).errors[0]!.reason).toBe(
      "the expression is nested more than 500 levels deep",
    );
    expect(parseRuleText(`A' = ${"!".repeat(100_000)}A`).errors[0]!.reason).toBe(
      "the expression is nested more than 500 levels deep",
    );
  });

  it("readRuleText, printRuleText and compileDefinition handle a chain of 100000 terms", () => {
    const names = Array.from({ length: 16 }, (_, i) => `g${i}`);
    const terms = Array.from(
      { length: 100_000 },
      (_, t) => `${t % 3 ? "!" : ""}${names[t % 16]} & ${names[(t * 7 + 3) % 16]}`,
    );
    const text = `${names.map((n) => `${n}' = ${n}`).join("\n")}\nX' = ${terms.join(" | ")}\n`;
    const model = readRuleText(text);
    expect(printRuleText(model)).toBe(text);
    expect(compileDefinition(model).tables[16]!.length).toBe(1 << 16);
  });

  it("readRuleText throws the first error and counts the others", () => {
    expect(() => readRuleText("A' = \nB' = ")).toThrow(
      /missing expression after A' = \(and 1 more error\) \(line 1, column 6\)/,
    );
  });

  it("parseRuleText keeps source positions on the parsed rules for the editor", () => {
    const { rules } = parseRuleText("\n  A' = !B\nB' = A");
    expect(rules[0]).toMatchObject({
      name: "A",
      line: 2,
      column: 3,
      rule: { kind: "not", pos: { line: 2, column: 8 }, arg: { pos: { line: 2, column: 9 } } },
    });
  });

  it("readRuleText reads the example of docs/rule-text.md", () => {
    const doc = readFileSync(new URL("../../../docs/rule-text.md", import.meta.url), "utf8");
    const example = /```\n([\s\S]*?)```/.exec(doc)![1]!;
    expect(readRuleText(example).nodes.map((n) => n.name)).toEqual([
      "Signal",
      "Kinase",
      "Phosphatase",
      "Stress",
      "Arrest",
    ]);
  });

  it("parseRuleText(printRuleText(m)) gives back m for random models", () => {
    fc.assert(
      fc.property(modelArb(), (model) => {
        const result = parseRuleText(printRuleText(model));
        expect(result.errors).toEqual([]);
        expect(result.definition).toEqual(model);
      }),
      { seed: 4101, numRuns: 500 },
    );
  });

  it("printRuleText is a fixed point on its own output", () => {
    fc.assert(
      fc.property(modelArb(), (model) => {
        const text = printRuleText(model);
        expect(printRuleText(readRuleText(text))).toBe(text);
      }),
      { seed: 4102, numRuns: 200 },
    );
  });
});
