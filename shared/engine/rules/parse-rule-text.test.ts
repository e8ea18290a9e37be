import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ParseError } from "../errors";
import { parseRuleText, readRuleText } from "./parse-rule-text";
import { compileDefinition } from "./compile-definition";
import { MAX_NAME_CHARS, MAX_NODES, MAX_REPORTED_ERRORS, MAX_RULE_CHARS, MAX_RULE_TEXT_CHARS } from "./limits";
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

  it("parseRuleText accepts exactly 500 open nots or parentheses and refuses the 501st where it stands", () => {
    const at = (text: string) => parseRuleText(text).errors.map((e) => [e.code, e.line, e.column]);
    expect(at(`A' = ${"!".repeat(500)}A`)).toEqual([]);
    expect(at(`A' = ${"(".repeat(500)}A${")".repeat(500)}`)).toEqual([]);
    expect(at(`A' = ${"!".repeat(501)}A`)).toEqual([["TOO_DEEP", 1, 506]]);
    expect(at(`A' = ${"(".repeat(501)}A${")".repeat(501)}`)).toEqual([["TOO_DEEP", 1, 506]]);
  });

  it("parseRuleText refuses a tree deeper than 500 levels made of changing operators, at the operator that crosses it", () => {
    // A | B & (A | B & (...)): two tree levels per parenthesis, so 251 groups make 502 levels with 251 parentheses.
    const nested = (groups: number) => "A | B & (".repeat(groups) + "A" + ")".repeat(groups);
    expect(parseRuleText(`A' = ${nested(249)}\nB' = B`).errors).toEqual([]);
    const { errors } = parseRuleText(`A' = ${nested(251)}\nB' = B`);
    expect(errors.map((e) => [e.code, e.line, e.reason])).toEqual([
      ["TOO_DEEP", 1, "the expression is nested more than 500 levels deep"],
    ]);
    expect(`A' = ${nested(251)}`[errors[0]!.column - 1]).toBe("|");
  });

  it("readRuleText, printRuleText and compileDefinition handle a chain of 100000 terms, and its definition survives JSON", () => {
    const names = Array.from({ length: 16 }, (_, i) => `g${i}`);
    const terms = Array.from(
      { length: 100_000 },
      (_, t) => `${t % 3 ? "!" : ""}${names[t % 16]} & ${names[(t * 7 + 3) % 16]}`,
    );
    const text = `${names.map((n) => `${n}' = ${n}`).join("\n")}\nX' = ${terms.join(" | ")}\n`;
    const model = readRuleText(text);
    expect(printRuleText(model)).toBe(text);
    expect(JSON.parse(JSON.stringify(model))).toEqual(model);
    expect(compileDefinition(model).tables[16]!.length).toBe(1 << 16);
  });

  it("readRuleText stores a rule of 4,100 terms as one flat node that JSON.stringify writes and reads back", () => {
    const model = readRuleText(`A' = ${Array(4100).fill("B").join(" & ")}\nB' = B\n`);
    const rule = model.nodes[0]!.rule;
    expect(rule.kind === "and" && rule.args.length).toBe(4100);
    expect(JSON.parse(JSON.stringify(model))).toEqual(model);
    expect(Array.from(compileDefinition(model).tables[0]!)).toEqual([0, 1]);
  });

  it("parseRuleText lists the first 100 errors in line order and counts the others", () => {
    const result = parseRuleText("A' = \n".repeat(1000));
    // Line 1 misses its expression; lines 2..1000 also repeat A: 1 + 2 * 999 errors.
    expect(result.errors).toHaveLength(MAX_REPORTED_ERRORS);
    expect(result.moreErrors).toBe(1999 - MAX_REPORTED_ERRORS);
    expect(result.errors.slice(0, 3).map((e) => [e.line, e.column, e.reason])).toEqual([
      [1, 6, "missing expression after A' ="],
      [2, 1, "duplicate rule for A (first on line 1)"],
      [2, 6, "missing expression after A' ="],
    ]);
    expect(result.errors.at(-1)!.line).toBe(51);
    expect(() => readRuleText("A' = \n".repeat(1000))).toThrow(/\(and 1998 more errors\) \(line 1, column 6\)$/);
  });

  it("parseRuleText stops reading at the rule after the 20,000th, whatever the lines hold", () => {
    const faulty = parseRuleText("A' = \n".repeat(300_000));
    expect(faulty.errors).toHaveLength(MAX_REPORTED_ERRORS);
    // 20,000 missing expressions, 19,999 duplicates and the limit itself; the 280,000 lines after it are not read.
    expect(faulty.errors.length + faulty.moreErrors).toBe(2 * MAX_NODES);
    const limit = parseRuleText(`${"A' = 1\n".repeat(MAX_NODES)}A' = 1\n`);
    expect(limit.rules).toHaveLength(MAX_NODES);
    expect(limit.errors.length + limit.moreErrors).toBe(MAX_NODES);
    const all = parseRuleText(Array.from({ length: MAX_NODES + 5 }, (_, i) => `N${i}' = 1`).join("\n"));
    expect(all.errors.map((e) => [e.code, e.line, e.column])).toEqual([["TOO_LARGE", MAX_NODES + 1, 1]]);
    expect(all.rules).toHaveLength(MAX_NODES);
  });

  it("parseRuleText refuses a text above 8 MiB and a line above 4 MiB before reading them", () => {
    const big = parseRuleText("# " + "x".repeat(MAX_RULE_TEXT_CHARS));
    expect(big.errors.map((e) => [e.code, e.line, e.column])).toEqual([["TOO_LARGE", 1, MAX_RULE_TEXT_CHARS + 1]]);
    const long = parseRuleText(`B' = B\nA' = ${"B & ".repeat(MAX_RULE_CHARS / 4)}B\n`);
    expect(long.errors.map((e) => [e.code, e.line, e.column])).toEqual([["TOO_LARGE", 2, MAX_RULE_CHARS + 1]]);
  });

  it("parseRuleText refuses a node that reads more than 20 regulators, and a name longer than 256 characters", () => {
    const regs = Array.from({ length: 21 }, (_, i) => `r${i}`);
    const inputs = regs.map((r) => `${r}' = ${r}`).join("\n");
    expect(parseRuleText(`${inputs}\nX' = ${regs.slice(0, 20).join(" | ")}`).errors).toEqual([]);
    expect(parseRuleText(`${inputs}\nX' = ${regs.join(" | ")}`).errors.map((e) => [e.code, e.line, e.reason])).toEqual([
      ["TOO_LARGE", 22, "X reads 21 nodes; a node may read at most 20"],
    ]);
    // tie keep reads the node itself as well
    const keep = `${inputs}\nX' = threshold(${regs
      .slice(0, 20)
      .map((r) => `+1 ${r}`)
      .join(", ")})`;
    expect(parseRuleText(keep).errors.map((e) => e.reason)).toEqual(["X reads 21 nodes; a node may read at most 20"]);
    const name = "N".repeat(MAX_NAME_CHARS + 1);
    expect(parseRuleText(`${name}' = 1`).errors.map((e) => [e.column, e.reason])).toEqual([
      [1, "this name has 257 characters; a node name may have at most 256"],
    ]);
    expect(parseRuleText(`${name.slice(1)}' = 1`).errors).toEqual([]);
  });

  it("parseRuleText skips a byte order mark, reads CRLF line ends and refuses __proto__ as a node name", () => {
    const result = parseRuleText("\uFEFFA' = !B\r\nB' = A\r\n");
    expect(result.errors).toEqual([]);
    expect(result.rules.map((r) => [r.name, r.line, r.column])).toEqual([
      ["A", 1, 1],
      ["B", 2, 1],
    ]);
    expect(parseRuleText("__proto__' = 1").errors[0]!.reason).toBe(
      '"__proto__" cannot name a node (JavaScript objects treat it specially)',
    );
    expect(parseRuleText("A' = __proto__").errors.map((e) => [e.column, e.reason])).toEqual([
      [6, '"__proto__" cannot name a node (JavaScript objects treat it specially)'],
    ]);
  });

  it("parseRuleText quotes control characters, lone surrogates and long text escaped in its messages", () => {
    const reason = (line: string) => parseRuleText(line).errors[0]!.reason;
    expect(reason("A' = B \u0007")).toBe('unknown character "\\u0007"');
    expect(reason("A' = B \u0000")).toBe('unknown character "\\u0000"');
    expect(reason("A' = B \uD800")).toBe('unknown character "\\uD800"');
    expect(reason("A' = B \uDC00x")).toBe('unknown character "\\uDC00"');
    expect(reason("A' = B \u202E")).toBe('unknown character "\\u202E"');
    expect(reason("A' = B \u{1F600}")).toBe('unknown character "\u{1F600}"');
    expect(reason(`A' = threshold(+${"9".repeat(5000)} B)`)).toBe(`number ${"9".repeat(40)}… is too large`);
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
