// Printer for Emulant rule text: writes any model in canonical form (symbol operators, minimal parentheses,
// threshold options in a fixed order) so that parsing the output gives back the same model.
// Parenthesisation follows operator precedence and left associativity, as in the grammar of parse-rule-text.ts.
import { EngineError } from "../errors";
import { chainOperands, isValidNodeName, type Expr, type ModelDefinition, type RuleSyntax } from "./syntax";

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
      // Left-associative: the head of a chain never needs parentheses for the same operator; an operand on the
      // right of equal precedence does.
      return chainOperands(e)
        .map((o, i) => {
          const text = printExpr(o);
          return PRECEDENCE[o.kind] < p || (i > 0 && PRECEDENCE[o.kind] === p) ? `(${text})` : text;
        })
        .join(` ${SYMBOL[e.kind]} `);
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
      throw new EngineError(
        "BAD_NAME",
        `node name "${node.name}" cannot be written as rule text (use letters, digits and _, not starting with a digit, not a reserved word)`,
      );
    }
  }
  return model.nodes.map((n) => `${n.name}' = ${printRule(n.rule)}\n`).join("");
}
