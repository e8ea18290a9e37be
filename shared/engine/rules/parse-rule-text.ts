// Parser for Emulant rule text (`Target' = expression`, one rule per line), by recursive descent with one token of
// lookahead (Aho, Sethi, Ullman, "Compilers", Addison-Wesley 1986, section 4.4). Precedence: not > and > xor > or.
// Each line is parsed on its own, so every faulty line reports its own error and the editor can show them all.
import { ParseError } from "../errors";
import { tokenizeLine, type Token, type TokenKind } from "./tokenizer";
import {
  RESERVED_WORDS,
  stripPositions,
  type BinaryOp,
  type Expr,
  type ModelDefinition,
  type RuleSyntax,
  type ThresholdRule,
  type ThresholdTerm,
} from "./syntax";

/** One parsed rule line, with source positions kept for the editor. */
export interface ParsedRule {
  readonly name: string;
  readonly line: number;
  readonly column: number;
  readonly rule: RuleSyntax;
}

export interface RuleTextResult {
  /** The model, or null when there is any error. */
  readonly definition: ModelDefinition | null;
  /** Every error found, in line order. */
  readonly errors: ParseError[];
  /** The rules that parsed, with positions (also present when other lines have errors). */
  readonly rules: ParsedRule[];
}

const MAX_NESTING = 500;

class LineError extends Error {
  constructor(
    readonly column: number,
    readonly reason: string,
  ) {
    super(reason);
  }
}

const DESCRIBE: Record<TokenKind, string> = {
  name: "a name",
  number: "a number",
  prime: "'",
  equals: "=",
  and: "and",
  or: "or",
  xor: "xor",
  not: "not",
  lparen: "(",
  rparen: ")",
  comma: ",",
  semicolon: ";",
  plus: "+",
  minus: "-",
  end: "end of line",
};

const describe = (t: Token) => (t.kind === "end" ? "end of line" : `"${t.text}"`);

class LineParser {
  private i = 0;
  constructor(
    private readonly tokens: Token[],
    private readonly line: number,
  ) {}

  private peek(): Token {
    return this.tokens[this.i]!;
  }
  private next(): Token {
    return this.tokens[this.i++]!;
  }
  private expect(kind: TokenKind, context: string): Token {
    const t = this.peek();
    if (t.kind !== kind) throw new LineError(t.column, `expected ${DESCRIBE[kind]} ${context}, found ${describe(t)}`);
    return this.next();
  }
  private pos(t: Token) {
    return { line: this.line, column: t.column };
  }

  parseRule(): ParsedRule {
    const target = this.peek();
    if (/^[A-Za-z]/.test(target.text)) this.checkName(target);
    if (target.kind !== "name") {
      throw new LineError(target.column, `expected a node name at the start of the rule, found ${describe(target)}`);
    }
    this.checkName(target);
    this.next();
    const afterName = this.peek();
    if (afterName.kind === "equals") {
      throw new LineError(afterName.column, `missing prime after ${target.text}; write ${target.text}' = ...`);
    }
    this.expect("prime", `after ${target.text}`);
    this.expect("equals", `after ${target.text}'`);
    const first = this.peek();
    let rule: RuleSyntax;
    if (
      first.kind === "name" &&
      first.text.toLowerCase() === "threshold" &&
      this.tokens[this.i + 1]?.kind === "lparen"
    ) {
      rule = this.parseThreshold();
    } else {
      if (first.kind === "end") throw new LineError(first.column, `missing expression after ${target.text}' =`);
      rule = this.parseOr();
    }
    const rest = this.peek();
    if (rest.kind !== "end") {
      const reason =
        rest.kind === "rparen" ? `unmatched ")"` : `unexpected ${describe(rest)} after a complete expression`;
      throw new LineError(rest.column, reason);
    }
    return { name: target.text, line: this.line, column: target.column, rule };
  }

  private checkName(t: Token): void {
    if (RESERVED_WORDS.has(t.text.toLowerCase()))
      throw new LineError(t.column, `"${t.text}" is a reserved word and cannot name a node`);
  }

  private parseBinary(op: BinaryOp, operand: () => Expr): Expr {
    let left = operand();
    while (this.peek().kind === op) {
      const t = this.next();
      const right = operand();
      left = { kind: op, left, right, pos: this.pos(t) };
    }
    return left;
  }

  private parseOr = (): Expr => this.parseBinary("or", this.parseXor);
  private parseXor = (): Expr => this.parseBinary("xor", this.parseAnd);
  private parseAnd = (): Expr => this.parseBinary("and", this.parseUnary);

  private depth = 0;

  private parseUnary = (): Expr => {
    const t = this.peek();
    // Nesting is bounded so that hostile input cannot exhaust the call stack.
    if (++this.depth > MAX_NESTING)
      throw new LineError(t.column, `the expression is nested more than ${MAX_NESTING} levels deep`);
    try {
      if (t.kind === "not") {
        this.next();
        return { kind: "not", arg: this.parseUnary(), pos: this.pos(t) };
      }
      return this.parseAtom();
    } finally {
      this.depth--;
    }
  };

  private parseAtom(): Expr {
    const t = this.next();
    switch (t.kind) {
      case "name":
        if (t.text.toLowerCase() === "threshold") {
          throw new LineError(t.column, `threshold(...) must be the whole right side of a rule`);
        }
        return { kind: "var", name: t.text, pos: this.pos(t) };
      case "number":
        if (t.text !== "0" && t.text !== "1")
          throw new LineError(t.column, `constant ${t.text} is not Boolean; use 0 or 1`);
        return { kind: "const", value: t.text === "1" ? 1 : 0, pos: this.pos(t) };
      case "lparen": {
        const inner = this.parseOr();
        const close = this.peek();
        if (close.kind !== "rparen")
          throw new LineError(close.column, `missing ")" to close "(" at column ${t.column}`);
        this.next();
        return inner;
      }
      case "prime":
        throw new LineError(t.column, `a prime may only follow the target on the left side`);
      default:
        throw new LineError(t.column, `expected a node name, 0, 1, "not" or "(", found ${describe(t)}`);
    }
  }

  private parseSignedInteger(context: string): number {
    let sign = 1;
    const s = this.peek();
    if (s.kind === "plus" || s.kind === "minus") {
      this.next();
      if (s.kind === "minus") sign = -1;
    }
    const n = this.expect("number", context);
    const value = sign * Number(n.text);
    if (!Number.isSafeInteger(value)) throw new LineError(n.column, `number ${n.text} is too large`);
    return value;
  }

  private parseThreshold(): ThresholdRule {
    const head = this.next();
    this.next(); // "(" checked by the caller's lookahead
    const terms: ThresholdTerm[] = [];
    const seen = new Map<string, number>();
    if (this.peek().kind !== "semicolon" && this.peek().kind !== "rparen") {
      for (;;) {
        const start = this.peek();
        if (start.kind === "name")
          throw new LineError(start.column, `write a weight before ${start.text}, e.g. +1 ${start.text}`);
        const weight = this.parseSignedInteger("as a weight");
        const node = this.expect("name", "after the weight");
        this.checkName(node);
        if (weight === 0) throw new LineError(start.column, `weight 0 has no effect; remove the term for ${node.text}`);
        const earlier = seen.get(node.text);
        if (earlier !== undefined)
          throw new LineError(node.column, `${node.text} already has a weight (column ${earlier})`);
        seen.set(node.text, node.column);
        terms.push({ weight, node: node.text, pos: this.pos(node) });
        if (this.peek().kind !== "comma") break;
        this.next();
      }
    }
    let offset: number | undefined;
    let tie: "keep" | "zero" | undefined;
    while (this.peek().kind === "semicolon") {
      this.next();
      const key = this.expect("name", `after ";" (offset or tie)`);
      const word = key.text.toLowerCase();
      if (word === "offset") {
        if (offset !== undefined) throw new LineError(key.column, `offset is given twice`);
        offset = this.parseSignedInteger("after offset");
      } else if (word === "tie") {
        if (tie !== undefined) throw new LineError(key.column, `tie is given twice`);
        const value = this.expect("name", "after tie (keep or zero)");
        const v = value.text.toLowerCase();
        if (v !== "keep" && v !== "zero")
          throw new LineError(value.column, `tie must be keep or zero, found "${value.text}"`);
        tie = v;
      } else {
        throw new LineError(key.column, `unknown threshold option "${key.text}"; use offset or tie`);
      }
    }
    const close = this.peek();
    if (close.kind !== "rparen") {
      const reason =
        close.kind === "end"
          ? `missing ")" to close threshold(`
          : `expected "," or ";" or ")" in threshold(...), found ${describe(close)}`;
      throw new LineError(close.column, reason);
    }
    this.next();
    return { kind: "threshold", terms, offset: offset ?? 0, tie: tie ?? "keep", pos: this.pos(head) };
  }
}

/** Parse rule text, collecting every error (one per faulty line, plus duplicate and undefined nodes). */
export function parseRuleText(text: string): RuleTextResult {
  const errors: ParseError[] = [];
  const rules: ParsedRule[] = [];
  const lines = text.split("\n");
  lines.forEach((raw, index) => {
    const lineNo = index + 1;
    const tokenized = tokenizeLine(raw);
    if (!tokenized.ok) {
      errors.push(new ParseError(tokenized.reason, lineNo, tokenized.column));
      return;
    }
    if (tokenized.tokens.length === 1) return; // blank or comment-only line
    try {
      rules.push(new LineParser(tokenized.tokens, lineNo).parseRule());
    } catch (e) {
      if (!(e instanceof LineError)) throw e;
      errors.push(new ParseError(e.reason, lineNo, e.column));
    }
  });

  // Targets are read from every line whose start looks like `Name' =`, so a duplicate is found even when one of
  // the two lines has a syntax error further right, and nodes of faulty lines are not reported as undefined.
  const firstTarget = new Map<string, number>();
  lines.forEach((raw, index) => {
    const m = /^(\s*)([A-Za-z_][A-Za-z0-9_]*)\s*'?\s*=/.exec(raw);
    if (!m) return;
    const name = m[2]!;
    const earlier = firstTarget.get(name);
    if (earlier === undefined) firstTarget.set(name, index + 1);
    else
      errors.push(new ParseError(`duplicate rule for ${name} (first on line ${earlier})`, index + 1, m[1]!.length + 1));
  });
  const reported = new Set<string>();
  for (const r of rules) {
    for (const use of usesOf(r.rule)) {
      if (firstTarget.has(use.name) || reported.has(use.name)) continue;
      reported.add(use.name);
      errors.push(
        new ParseError(
          `node ${use.name} is used on line ${use.pos.line} but has no rule; add \`${use.name}' = ${use.name}\` to make it an input`,
          use.pos.line,
          use.pos.column,
        ),
      );
    }
  }
  if (errors.length === 0 && rules.length === 0)
    errors.push(new ParseError("the text has no rules; write one line per node, e.g. A' = !B", 1, 1));
  errors.sort((a, b) => a.line - b.line || a.column - b.column);
  const definition =
    errors.length === 0 ? { nodes: rules.map((r) => ({ name: r.name, rule: stripPositions(r.rule) })) } : null;
  return { definition, errors, rules };
}

/** Parse rule text and return the model, or throw the first ParseError (its message counts the others). */
export function readRuleText(text: string): ModelDefinition {
  const result = parseRuleText(text);
  if (result.definition) return result.definition;
  const first = result.errors[0]!;
  const more = result.errors.length - 1;
  if (more === 0) throw first;
  throw new ParseError(`${first.reason} (and ${more} more error${more === 1 ? "" : "s"})`, first.line, first.column);
}

function usesOf(rule: RuleSyntax): { name: string; pos: { line: number; column: number } }[] {
  const out: { name: string; pos: { line: number; column: number } }[] = [];
  const stack: Expr[] = [];
  const visit = (root: Expr): void => {
    stack.push(root);
    while (stack.length > 0) {
      const e = stack.pop()!;
      if (e.kind === "var") out.push({ name: e.name, pos: e.pos! });
      else if (e.kind === "not") stack.push(e.arg);
      else if (e.kind !== "const") stack.push(e.right, e.left);
    }
  };
  if (rule.kind === "threshold") for (const t of rule.terms) out.push({ name: t.node, pos: t.pos! });
  else visit(rule);
  return out;
}
