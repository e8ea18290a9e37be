// Printer for Emulant rule text: writes any model in canonical form (symbol operators, minimal parentheses,
// threshold options in a fixed order) so that parsing the output gives back the same model.
// Parenthesisation follows operator precedence, as in the grammar of parse-rule-text.ts: an operand is put in
// parentheses when it binds no tighter than its operator, so a nested chain of the same operator keeps its own node.
import { EngineError } from "../errors";
import { showInput } from "./show-input";
import { isValidNodeName, mapExpr, type Expr, type ModelDefinition, type RuleSyntax } from "./syntax";

const PRECEDENCE = { or: 1, xor: 2, and: 3, not: 4, const: 5, var: 5 } as const;
const SYMBOL = { or: " | ", xor: " ^ ", and: " & " } as const;

interface Printed {
  readonly text: string;
  readonly precedence: number;
}

/** Print a Boolean expression with the fewest parentheses that keep its tree (no recursion: any depth prints). */
export function printExpr(e: Expr): string {
  return mapExpr<Printed>(e, (x, args) => {
    const precedence = PRECEDENCE[x.kind];
    switch (x.kind) {
      case "const":
        return { text: String(x.value), precedence };
      case "var":
        return { text: x.name, precedence };
      case "not": {
        const inner = args[0]!;
        return { text: inner.precedence < precedence ? `!(${inner.text})` : `!${inner.text}`, precedence };
      }
      default: {
        // Concatenation, not join: join copies each operand's text into a new flat string, which made a tree
        // nested 100,000 levels deep print in quadratic time; concatenation builds ropes and copies once at the end.
        let text = "";
        args.forEach((o, i) => {
          const part = o.precedence <= precedence ? `(${o.text})` : o.text;
          text = i === 0 ? part : text + SYMBOL[x.kind] + part;
        });
        return { text, precedence };
      }
    }
  }).text;
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
        `node name "${showInput(node.name)}" cannot be written as rule text (use letters, digits and _, not starting with a digit, not a reserved word)`,
      );
    }
  }
  return model.nodes.map((n) => `${n.name}' = ${printRule(n.rule)}\n`).join("");
}
