// The source-level model: what a modeler writes and what the database stores (plain JSON, no typed arrays).
// Boolean rules follow the logical-model convention of Kauffman, "Metabolic stability and epigenesis in randomly
// constructed genetic nets", J. Theor. Biol. 1969; threshold rules follow Li, Long, Lu, Ouyang, Tang, PNAS 2004.

/** 1-based position in a rule text; present only on trees that came straight from the parser. */
export interface SourcePos {
  readonly line: number;
  readonly column: number;
}

export type BinaryOp = "and" | "or" | "xor";

/** Boolean expression tree. Binary operators are left-associative, so `a & b & c` is and(and(a, b), c). */
export type Expr =
  | { readonly kind: "const"; readonly value: 0 | 1; readonly pos?: SourcePos }
  | { readonly kind: "var"; readonly name: string; readonly pos?: SourcePos }
  | { readonly kind: "not"; readonly arg: Expr; readonly pos?: SourcePos }
  | { readonly kind: BinaryOp; readonly left: Expr; readonly right: Expr; readonly pos?: SourcePos };

export interface ThresholdTerm {
  /** Non-zero integer weight. */
  readonly weight: number;
  readonly node: string;
  readonly pos?: SourcePos;
}

/**
 * Weighted-sum rule: with s = sum of weight * value over the terms, the next value is 1 when s > offset,
 * 0 when s < offset, and on a tie the current value ("keep") or 0 ("zero", self-degradation).
 */
export interface ThresholdRule {
  readonly kind: "threshold";
  readonly terms: readonly ThresholdTerm[];
  readonly offset: number;
  readonly tie: "keep" | "zero";
  readonly pos?: SourcePos;
}

export type RuleSyntax = Expr | ThresholdRule;

export interface NodeDefinition {
  readonly name: string;
  readonly rule: RuleSyntax;
}

/** The source-level model, JSON-serialisable; node order is model order. */
export interface ModelDefinition {
  readonly nodes: readonly NodeDefinition[];
}

/** Words that cannot be node names (compared case-insensitively). */
export const RESERVED_WORDS: ReadonlySet<string> = new Set(["and", "or", "not", "xor", "threshold"]);

const NAME_PATTERN = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** A node name is an identifier (letters, digits, underscore; not starting with a digit) and not a reserved word. */
export function isValidNodeName(name: string): boolean {
  return NAME_PATTERN.test(name) && !RESERVED_WORDS.has(name.toLowerCase());
}

export type BinaryExpr = Extract<Expr, { kind: BinaryOp }>;

/**
 * The operands of the longest left chain of one operator: for ((a & b) & c) & d it is [a, b, c, d].
 * Long sums of products are such chains; walking them in a loop keeps recursion depth at the real nesting depth.
 */
export function chainOperands(e: BinaryExpr): Expr[] {
  const rights: Expr[] = [];
  let x: Expr = e;
  while (x.kind === e.kind) {
    const b = x as BinaryExpr;
    rights.push(b.right);
    x = b.left;
  }
  rights.push(x);
  return rights.reverse();
}

/** Variables an expression or rule reads, each once, in first-use (left to right) order. */
export function variablesOf(rule: RuleSyntax): string[] {
  const seen = new Set<string>();
  if (rule.kind === "threshold") {
    for (const t of rule.terms) seen.add(t.node);
    return [...seen];
  }
  const stack: Expr[] = [rule];
  while (stack.length > 0) {
    const e = stack.pop()!;
    if (e.kind === "var") seen.add(e.name);
    else if (e.kind === "not") stack.push(e.arg);
    else if (e.kind !== "const") stack.push(e.right, e.left);
  }
  return [...seen];
}

/** A copy of a rule without source positions, so parsed and built definitions compare equal. */
export function stripPositions(rule: RuleSyntax): RuleSyntax {
  if (rule.kind === "threshold") {
    return {
      kind: "threshold",
      terms: rule.terms.map((t) => ({ weight: t.weight, node: t.node })),
      offset: rule.offset,
      tie: rule.tie,
    };
  }
  return stripExpr(rule);
}

function stripExpr(e: Expr): Expr {
  switch (e.kind) {
    case "const":
      return { kind: "const", value: e.value };
    case "var":
      return { kind: "var", name: e.name };
    case "not":
      return { kind: "not", arg: stripExpr(e.arg) };
    default: {
      const [first, ...rest] = chainOperands(e).map(stripExpr);
      return rest.reduce<Expr>((left, right) => ({ kind: e.kind, left, right }), first!);
    }
  }
}
