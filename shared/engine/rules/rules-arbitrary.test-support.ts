// fast-check generators of random models for the rule-text tests (shared by several test files in this folder).
import fc from "fast-check";
import type { Expr, ModelDefinition, RuleSyntax } from "./syntax";

const NAME_POOL = ["A", "b", "CycD", "p27", "E2F", "_x", "Cdc20", "node_7", "Xor1", "notch", "ORC", "t"];

export function exprArb(names: readonly string[], depth = 4): fc.Arbitrary<Expr> {
  const leaf: fc.Arbitrary<Expr> = fc.oneof(
    { weight: 4, arbitrary: fc.constantFrom(...names).map((name): Expr => ({ kind: "var", name })) },
    { weight: 1, arbitrary: fc.constantFrom<0 | 1>(0, 1).map((value): Expr => ({ kind: "const", value })) },
  );
  if (depth === 0) return leaf;
  const sub = exprArb(names, depth - 1);
  return fc.oneof(
    { weight: 3, arbitrary: leaf },
    { weight: 1, arbitrary: sub.map((arg): Expr => ({ kind: "not", arg })) },
    {
      weight: 3,
      arbitrary: fc
        .tuple(
          fc.constantFrom("and", "or", "xor") as fc.Arbitrary<"and" | "or" | "xor">,
          fc.array(sub, { minLength: 2, maxLength: 4 }),
        )
        .map(([kind, args]): Expr => ({ kind, args })),
    },
  );
}

export function ruleArb(names: readonly string[]): fc.Arbitrary<RuleSyntax> {
  const threshold = fc
    .tuple(
      fc.shuffledSubarray([...names], { minLength: 0, maxLength: names.length }),
      fc.array(
        fc.integer({ min: -3, max: 3 }).filter((w) => w !== 0),
        { minLength: names.length, maxLength: names.length },
      ),
      fc.integer({ min: -2, max: 2 }),
      fc.constantFrom<"keep" | "zero">("keep", "zero"),
    )
    .map(([nodes, weights, offset, tie]): RuleSyntax => ({
      kind: "threshold",
      terms: nodes.map((node, i) => ({ weight: weights[i]!, node })),
      offset,
      tie,
    }));
  return fc.oneof({ weight: 4, arbitrary: exprArb(names) }, { weight: 1, arbitrary: threshold });
}

/** Random models of 1..maxNodes nodes (names drawn from `pool`) whose rules only read defined nodes. */
export function modelArb(maxNodes = 6, pool: readonly string[] = NAME_POOL): fc.Arbitrary<ModelDefinition> {
  return fc
    .shuffledSubarray([...pool], { minLength: 1, maxLength: maxNodes })
    .chain((names) =>
      fc
        .tuple(...names.map(() => ruleArb(names)))
        .map((rules) => ({ nodes: names.map((name, i) => ({ name, rule: rules[i]! })) })),
    );
}
