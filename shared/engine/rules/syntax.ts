// The source-level model: what a modeler writes and what the database stores (plain JSON, no typed arrays).
// Boolean rules follow the logical-model convention of Kauffman, "Metabolic stability and epigenesis in randomly
// constructed genetic nets", J. Theor. Biol. 1969; threshold rules follow Li, Long, Lu, Ouyang, Tang, PNAS 2004.
import { MAX_NAME_CHARS } from "./limits";

/** 1-based position in a rule text; present only on trees that came straight from the parser. */
export interface SourcePos {
  readonly line: number;
  readonly column: number;
}

/** The associative operators; each node of one holds all operands of a chain, `a & b & c` is and(a, b, c). */
export type NaryOp = "and" | "or" | "xor";

/**
 * Boolean expression tree. An operator node has two or more operands. Chains are flat, so a stored rule is as deep as
 * its real nesting, not as long as its longest chain: `a & b & c` is and(a, b, c), `(a & b) & c` is
 * and(and(a, b), c), and printing keeps that difference.
 */
export type Expr =
  | { readonly kind: "const"; readonly value: 0 | 1; readonly pos?: SourcePos }
  | { readonly kind: "var"; readonly name: string; readonly pos?: SourcePos }
  | { readonly kind: "not"; readonly arg: Expr; readonly pos?: SourcePos }
  | { readonly kind: NaryOp; readonly args: readonly Expr[]; readonly pos?: SourcePos };

export type NaryExpr = Extract<Expr, { kind: NaryOp }>;

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

/**
 * A name JavaScript objects treat specially: assigning it changes an object's prototype instead of adding a key, so
 * any plain-object record keyed by node names (JSON bodies parsed by schemas, certificate contexts) would silently
 * lose it. It cannot name a node; every other identifier can, including `constructor` and `toString`.
 */
export const PROTOTYPE_KEY = "__proto__";

const NAME_PATTERN = /^[A-Za-z_][A-Za-z0-9_]*$/;

/**
 * A node name is an identifier (letters, digits, underscore; not starting with a digit) of at most MAX_NAME_CHARS
 * characters, not a reserved word and not `__proto__`.
 */
export function isValidNodeName(name: string): boolean {
  return (
    name.length <= MAX_NAME_CHARS &&
    NAME_PATTERN.test(name) &&
    !RESERVED_WORDS.has(name.toLowerCase()) &&
    name !== PROTOTYPE_KEY
  );
}

/** Calls `visit` on every node of an expression, parents before children, operands left to right; no recursion. */
export function forEachSubexpression(root: Expr, visit: (e: Expr) => void): void {
  const stack: Expr[] = [root];
  while (stack.length > 0) {
    const e = stack.pop()!;
    visit(e);
    if (e.kind === "not") stack.push(e.arg);
    else if (e.kind !== "const" && e.kind !== "var")
      for (let i = e.args.length - 1; i >= 0; i--) stack.push(e.args[i]!);
  }
}

/** Variables an expression or rule reads, each once, in first-use (left to right) order. */
export function variablesOf(rule: RuleSyntax): string[] {
  const seen = new Set<string>();
  if (rule.kind === "threshold") for (const t of rule.terms) seen.add(t.node);
  else
    forEachSubexpression(rule, (e) => {
      if (e.kind === "var") seen.add(e.name);
    });
  return [...seen];
}

/**
 * The first node (in reading order) that lies more than `maxDepth` levels deep, counting `not` and operator nodes on
 * the path from the root (the root operator is level 1, a leaf adds none); null when the whole tree is shallow enough.
 */
export function firstTooDeep(root: Expr, maxDepth: number): Expr | null {
  const nodes: Expr[] = [root];
  const depths: number[] = [0];
  while (nodes.length > 0) {
    const e = nodes.pop()!;
    const above = depths.pop()!;
    if (e.kind === "const" || e.kind === "var") continue;
    const depth = above + 1;
    if (depth > maxDepth) return e;
    if (e.kind === "not") {
      nodes.push(e.arg);
      depths.push(depth);
    } else
      for (let i = e.args.length - 1; i >= 0; i--) {
        nodes.push(e.args[i]!);
        depths.push(depth);
      }
  }
  return null;
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
  return mapExpr<Expr>(rule, (e, args) => {
    switch (e.kind) {
      case "const":
        return { kind: "const", value: e.value };
      case "var":
        return { kind: "var", name: e.name };
      case "not":
        return { kind: "not", arg: args[0]! };
      default:
        return { kind: e.kind, args };
    }
  });
}

/**
 * Rebuilds an expression bottom-up: `build` receives each node and the rebuilt operands (one for `not`, none for
 * leaves). A loop with an explicit stack, so the depth of the tree never meets the depth of the call stack.
 */
export function mapExpr<T>(root: Expr, build: (e: Expr, args: T[]) => T): T {
  // Each frame is a node and the index of the next operand to visit; results of finished operands wait in `done`.
  const nodes: Expr[] = [root];
  const next: number[] = [0];
  const done: T[] = [];
  const starts: number[] = [0];
  for (;;) {
    const top = nodes.length - 1;
    const e = nodes[top]!;
    const operands = e.kind === "not" ? 1 : e.kind === "const" || e.kind === "var" ? 0 : e.args.length;
    const i = next[top]!;
    if (i < operands) {
      next[top] = i + 1;
      nodes.push(e.kind === "not" ? e.arg : (e as NaryExpr).args[i]!);
      next.push(0);
      starts.push(done.length);
      continue;
    }
    const start = starts[top]!;
    const value = build(e, done.splice(start));
    nodes.pop();
    next.pop();
    starts.pop();
    if (nodes.length === 0) return value;
    done.push(value);
  }
}
