// Definitions stored before operator chains became flat nodes hold binary nodes ({ kind, left, right }, chains
// nested to the left). This reads either form into the current one, so revisions written then stay readable:
// a left chain becomes one node with all its operands, which is exactly what parsing its printed text gives.
import type { Expr, ModelDefinition, NaryOp, RuleSyntax } from "./syntax";

type BinaryNode = { readonly kind: NaryOp; readonly left: StoredExpr; readonly right: StoredExpr };
/** An expression as it may be stored: the current form, or binary operator nodes anywhere inside. */
export type StoredExpr =
  | Exclude<Expr, { kind: NaryOp }>
  | { readonly kind: "not"; readonly arg: StoredExpr }
  | { readonly kind: NaryOp; readonly args: readonly StoredExpr[] }
  | BinaryNode;

const isBinary = (e: StoredExpr): e is BinaryNode => Object.hasOwn(e, "left") && Object.hasOwn(e, "right");

/** The operands a stored node stands for: a binary node's whole left chain of the same operator, in order. */
function operandsOf(e: StoredExpr): readonly StoredExpr[] {
  if (e.kind === "const" || e.kind === "var") return [];
  if (e.kind === "not") return [e.arg];
  if (!isBinary(e)) return e.args;
  const rights: StoredExpr[] = [];
  let x: StoredExpr = e;
  while (x.kind === e.kind && isBinary(x)) {
    rights.push(x.right);
    x = x.left;
  }
  rights.push(x);
  return rights.reverse();
}

/** One stored expression in the current form; a loop with an explicit stack, as stored trees may be deep. */
export function upgradeExpr(root: StoredExpr): Expr {
  const nodes: StoredExpr[] = [root];
  const operands: (readonly StoredExpr[])[] = [operandsOf(root)];
  const next: number[] = [0];
  const done: Expr[] = [];
  const starts: number[] = [0];
  for (;;) {
    const top = nodes.length - 1;
    const i = next[top]!;
    if (i < operands[top]!.length) {
      next[top] = i + 1;
      const child = operands[top]![i]!;
      nodes.push(child);
      operands.push(operandsOf(child));
      next.push(0);
      starts.push(done.length);
      continue;
    }
    const e = nodes[top]!;
    const args = done.splice(starts[top]!);
    const value: Expr =
      e.kind === "const" || e.kind === "var"
        ? e
        : e.kind === "not"
          ? { kind: "not", arg: args[0]! }
          : { kind: e.kind, args };
    nodes.pop();
    operands.pop();
    next.pop();
    starts.pop();
    if (nodes.length === 0) return value;
    done.push(value);
  }
}

/** A stored definition in the current form (unchanged when it already is). */
export function upgradeDefinition(stored: {
  readonly nodes: readonly {
    readonly name: string;
    readonly rule: StoredExpr | Extract<RuleSyntax, { kind: "threshold" }>;
  }[];
}): ModelDefinition {
  return {
    nodes: stored.nodes.map((n) => ({
      name: n.name,
      rule: n.rule.kind === "threshold" ? n.rule : upgradeExpr(n.rule),
    })),
  };
}
