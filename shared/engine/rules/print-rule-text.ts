// Printer for Emulant rule text: writes any model in canonical form (symbol operators, minimal parentheses,
// threshold options in a fixed order) so that parsing the output gives back the same model.
// Parenthesisation follows operator precedence and left associativity, as in the grammar of parse-rule-text.ts.
import { EngineError } from "../errors";
import { isValidNodeName, type Expr, type ModelDefinition, type RuleSyntax } from "./syntax";

const PRECEDENCE = { or: 1, xor: 2, and: 3, not: 4, const: 5, var: 5 } as const;
const SYMBOL = { or: "|", xor: "^", and: "&" } as const;

/** Print a Boolean expression with the fewest parentheses that keep its tree. */
export function printExpr(e: Expr): string {
  switch (e.kind) {
    case "const":
      return String(e.value);
    case "var":
      return e.name;
    case "not": {
      const inner = printExpr(e.arg);
      return PRECEDENCE[e.arg.kind] < PRECEDENCE.not ? `!(${inner})` : `!${inner}`;
    }
    default: {
      const p = PRECEDENCE[e.kind];
      const left = printExpr(e.left);
      const right = printExpr(e.right);
      // Left-associative: an equal-precedence operator on the right needs parentheses, on the left it does not.
      const l = PRECEDENCE[e.left.kind] < p ? `(${left})` : left;
      const r = PRECEDENCE[e.right.kind] <= p ? `(${right})` : right;
      return `${l} ${SYMBOL[e.kind]} ${r}`;
    }
  }
}

/** Print the right side of a rule. */
export function printRule(rule: RuleSyntax): string {
  if (rule.kind !== "threshold") return printExpr(rule);
  const terms = rule.terms.map((t) => `${t.weight > 0 ? "+" : ""}${t.weight} ${t.node}`).join(", ");
  const offset = rule.offset !== 0 ? `; offset ${rule.offset}` : "";
  return `threshold(${terms}${offset}; tie ${rule.tie})`;
}

/** Print a whole model, one rule per line, in model order. */
export function printRuleText(model: ModelDefinition): string {
  for (const node of model.nodes) {
    if (!isValidNodeName(node.name)) {
      throw new EngineError("BAD_NAME", `node name "${node.name}" cannot be written as rule text (use letters, digits and _, not starting with a digit, not a reserved word)`);
    }
  }
  return model.nodes.map((n) => `${n.name}' = ${printRule(n.rule)}\n`).join("");
}
