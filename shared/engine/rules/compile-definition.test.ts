import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { BooleanNetwork } from "../network";
import { compileDefinition, evaluateExpr, truthTableOf } from "./compile-definition";
import { readRuleText } from "./parse-rule-text";
import { exprArb, modelArb } from "./rules-arbitrary.test-support";
import type { Expr, ModelDefinition, RuleSyntax } from "./syntax";
import { YEAST_RULE_TEXT } from "./yeast-rule-text.test-support";

/** Plain reference: the next value of node i from a full state, straight from the rule tree. */
function referenceNext(model: ModelDefinition, i: number, state: number): number {
  const index = new Map(model.nodes.map((n, k) => [n.name, k]));
  const val = (name: string) => (state >> index.get(name)!) & 1;
  const ev = (e: Expr): boolean => {
    switch (e.kind) {
      case "const":
        return e.value === 1;
      case "var":
        return val(e.name) === 1;
      case "not":
        return !ev(e.arg);
      case "and":
        return e.args.every(ev);
      case "or":
        return e.args.some(ev);
      case "xor":
        return e.args.filter(ev).length % 2 === 1;
    }
  };
  const rule: RuleSyntax = model.nodes[i]!.rule;
  if (rule.kind !== "threshold") return ev(rule) ? 1 : 0;
  const sum = rule.terms.reduce((s, t) => s + t.weight * val(t.node), 0);
  if (sum === rule.offset) return rule.tie === "keep" ? (state >> i) & 1 : 0;
  return sum > rule.offset ? 1 : 0;
}

function networkNext(net: BooleanNetwork, i: number, state: number): number {
  let row = 0;
  net.regulators[i]!.forEach((r, j) => (row |= ((state >> r) & 1) << j));
  return net.tables[i]![row]!;
}

function synchronousAttractorBasins(net: BooleanNetwork): { state: number; basin: number; fixed: boolean }[] {
  const n = net.names.length;
  const next = (s: number) => {
    let t = 0;
    for (let i = 0; i < n; i++) t |= networkNext(net, i, s) << i;
    return t;
  };
  const counts = new Map<number, number>();
  for (let s = 0; s < 1 << n; s++) {
    const seen = new Set<number>();
    let x = s;
    while (!seen.has(x)) {
      seen.add(x);
      x = next(x);
    }
    let min = x;
    for (let y = next(x); y !== x; y = next(y)) min = Math.min(min, y);
    counts.set(min, (counts.get(min) ?? 0) + 1);
  }
  return [...counts]
    .map(([state, basin]) => ({ state, basin, fixed: next(state) === state }))
    .sort((a, b) => b.basin - a.basin);
}

describe("compileDefinition", () => {
  it("compileDefinition lists the nodes a rule reads in model order and tabulates the rule", () => {
    const net = compileDefinition(readRuleText("A' = C & !B\nB' = 1\nC' = A | C\n"));
    expect(net.names).toEqual(["A", "B", "C"]);
    expect(Array.from(net.regulators[0]!)).toEqual([1, 2]);
    expect(Array.from(net.tables[0]!)).toEqual([0, 0, 1, 0]); // rows (B,C) = 00, 10, 01, 11
    expect(Array.from(net.regulators[1]!)).toEqual([]);
    expect(Array.from(net.tables[1]!)).toEqual([1]);
  });

  it("compileDefinition gives a threshold rule with tie keep its own node as a regulator, and tie zero not", () => {
    const net = compileDefinition(
      readRuleText("A' = threshold(+1 B; tie keep)\nB' = threshold(+1 A, -1 C; offset 0; tie zero)\nC' = C\n"),
    );
    expect(Array.from(net.regulators[0]!)).toEqual([0, 1]);
    expect(Array.from(net.tables[0]!)).toEqual([0, 1, 1, 1]); // sum 0 keeps A, B = 1 switches on
    expect(Array.from(net.regulators[1]!)).toEqual([0, 2]);
    expect(Array.from(net.tables[1]!)).toEqual([0, 1, 0, 0]); // only A without C is above 0
  });

  it("compileDefinition agrees with a direct evaluation of the rules on every state of random models", () => {
    fc.assert(
      fc.property(modelArb(), (model) => {
        const net = compileDefinition(model);
        for (let s = 0; s < 1 << model.nodes.length; s++) {
          for (let i = 0; i < model.nodes.length; i++) expect(networkNext(net, i, s)).toBe(referenceNext(model, i, s));
        }
      }),
      { seed: 4201, numRuns: 300 },
    );
  });

  it("truthTableOf agrees with one-row-at-a-time evaluation on sums of products over up to 12 inputs", () => {
    const inputs = Array.from({ length: 12 }, (_, j) => `i${j}`);
    const literal = fc
      .tuple(fc.constantFrom(...inputs), fc.boolean())
      .map(([name, neg]): Expr => (neg ? { kind: "not", arg: { kind: "var", name } } : { kind: "var", name }));
    const product = fc
      .array(literal, { minLength: 1, maxLength: 6 })
      .map((ls): Expr => (ls.length === 1 ? ls[0]! : { kind: "and", args: ls }));
    const operand = fc.oneof(product, exprArb(inputs, 3));
    const sum = fc
      .array(operand, { minLength: 1, maxLength: 12 })
      .map((ps): Expr => (ps.length === 1 ? ps[0]! : { kind: "or", args: ps }));
    fc.assert(
      fc.property(sum, fc.integer({ min: 1, max: 12 }), (expr, k) => {
        const used = new Set(inputs.slice(0, k));
        const rename = (e: Expr): Expr =>
          e.kind === "var"
            ? used.has(e.name)
              ? e
              : { kind: "var", name: `i${Number(e.name.slice(1)) % k}` }
            : e.kind === "not"
              ? { kind: "not", arg: rename(e.arg) }
              : e.kind === "const"
                ? e
                : { kind: e.kind, args: e.args.map(rename) };
        const inK = rename(expr);
        const table = truthTableOf(inK, inputs.slice(0, k));
        for (let row = 0; row < 1 << k; row++)
          expect(table[row]).toBe(evaluateExpr(inK, (name) => (row >> Number(name.slice(1))) & 1));
      }),
      { seed: 4203, numRuns: 300 },
    );
  });

  it("compileDefinition refuses operators with fewer than two operands, and binary nodes stored before chains were flat, with BAD_RULE", () => {
    const code = (rule: unknown) => {
      try {
        compileDefinition({ nodes: [{ name: "A", rule: rule as Expr }] });
      } catch (e) {
        return (e as { code?: string }).code;
      }
      return "compiled";
    };
    expect(code({ kind: "and", args: [] })).toBe("BAD_RULE");
    expect(code({ kind: "not", arg: { kind: "or", args: [{ kind: "var", name: "A" }] } })).toBe("BAD_RULE");
    expect(code({ kind: "xor", left: { kind: "var", name: "A" }, right: { kind: "const", value: 1 } })).toBe(
      "BAD_RULE",
    );
    expect(
      code({
        kind: "xor",
        args: [
          { kind: "var", name: "A" },
          { kind: "const", value: 1 },
        ],
      }),
    ).toBe("compiled");
  });

  it("compileDefinition rejects a rule that reads an undefined node, and duplicate or invalid names", () => {
    expect(() => compileDefinition({ nodes: [{ name: "A", rule: { kind: "var", name: "Z" } }] })).toThrow(
      /node Z is used in the rule of A but has no rule/,
    );
    expect(() =>
      compileDefinition({
        nodes: [
          { name: "A", rule: { kind: "const", value: 0 } },
          { name: "A", rule: { kind: "const", value: 1 } },
        ],
      }),
    ).toThrow(/two rules/);
    expect(() => compileDefinition({ nodes: [{ name: "not", rule: { kind: "const", value: 0 } }] })).toThrow(
      /not a valid node name/,
    );
  });

  it("compileDefinition of the budding-yeast threshold model has the published seven fixed points and basin sizes", () => {
    // Li et al., PNAS 2004 (see yeast-rule-text.test-support.ts): basins 1764, 151, 109, 9, 7, 7, 1 written from
    // memory; the biggest basin (1764 of 2048 states) is the G1 state with only Cdh1 and Sic1 on.
    const net = compileDefinition(readRuleText(YEAST_RULE_TEXT));
    const attractors = synchronousAttractorBasins(net);
    expect(attractors.every((a) => a.fixed)).toBe(true);
    expect(attractors.map((a) => a.basin)).toEqual([1764, 151, 109, 9, 7, 7, 1]);
    const g1 = attractors[0]!.state;
    expect(net.names.filter((_, i) => (g1 >> i) & 1)).toEqual(["Cdh1", "Sic1"]);
  });
});
