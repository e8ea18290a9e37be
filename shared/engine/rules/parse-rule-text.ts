// Parser for Emulant rule text (`Target' = expression`, one rule per line), by recursive descent with one token of
// lookahead (Aho, Sethi, Ullman, "Compilers", Addison-Wesley 1986, section 4.4). Precedence: not > and > xor > or.
// Each line is parsed on its own, so every faulty line reports its own error and the editor can show them all.
// Reading is linear in the text: the limits of limits.ts are checked as the text is read, before any rule is compiled.
import { ParseError } from "../errors";
import { ErrorList, firstErrorCounting } from "./error-list";
import { MAX_NESTING_DEPTH, MAX_NODES, MAX_REGULATORS, MAX_RULE_CHARS, MAX_RULE_TEXT_CHARS } from "./limits";
import { showInput } from "./show-input";
import { LineScanner, TokenError, type Token, type TokenKind } from "./tokenizer";
import {
  PROTOTYPE_KEY,
  RESERVED_WORDS,
  firstTooDeep,
  forEachSubexpression,
  stripPositions,
  type Expr,
  type ModelDefinition,
  type NaryOp,
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
  /** The first errors in line order, at most MAX_REPORTED_ERRORS of them. */
  readonly errors: ParseError[];
  /**
   * How many more errors were found than `errors` lists. Reading stops at a limit of limits.ts (text size, node
   * count), so after a limit error this counts only what was found before it.
   */
  readonly moreErrors: number;
  /** The rules that parsed, with positions (also present when other lines have errors). */
  readonly rules: ParsedRule[];
}

/**
 * A fault in one line, thrown inside the line parser and always caught by parseRuleText. Not an Error: capturing a
 * stack trace for every faulty line cost more than parsing the line (a text of 20,000 faulty lines took 0.6 s).
 */
class LineError {
  constructor(
    readonly column: number,
    readonly reason: string,
    readonly code = "PARSE_ERROR",
  ) {}
}

const DESCRIBE: ReadonlyMap<TokenKind, string> = new Map([
  ["name", "a name"],
  ["number", "a number"],
  ["prime", "'"],
  ["equals", "="],
  ["and", "and"],
  ["or", "or"],
  ["xor", "xor"],
  ["not", "not"],
  ["lparen", "("],
  ["rparen", ")"],
  ["comma", ","],
  ["semicolon", ";"],
  ["plus", "+"],
  ["minus", "-"],
  ["end", "end of line"],
]);

const describe = (t: Token) => (t.kind === "end" ? "end of line" : `"${showInput(t.text)}"`);

const CHAIN_OPERATORS: readonly NaryOp[] = ["or", "xor", "and"];

const TOO_DEEP = `the expression is nested more than ${MAX_NESTING_DEPTH} levels deep`;

class LineParser {
  private readonly tokens: LineScanner;
  /** Parentheses and `not`s open at this point of the descent (bounds the recursion); a thrown LineError ends the
   * line's parser, so the count needs no unwinding. */
  private depth = 0;

  constructor(
    text: string,
    private readonly line: number,
  ) {
    this.tokens = new LineScanner(text);
  }

  private peek(): Token {
    return this.tokens.peek();
  }
  private next(): Token {
    return this.tokens.next();
  }
  private expect(kind: TokenKind, context: string): Token {
    const t = this.peek();
    if (t.kind !== kind)
      throw new LineError(t.column, `expected ${DESCRIBE.get(kind)} ${context}, found ${describe(t)}`);
    return this.next();
  }
  private pos(t: Token) {
    return { line: this.line, column: t.column };
  }

  /** The rule of the line, or null for a blank or comment-only line. */
  parseRule(): ParsedRule | null {
    const target = this.peek();
    if (target.kind === "end") return null;
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
    if (first.kind === "name" && first.text.toLowerCase() === "threshold" && this.tokens.peek(1).kind === "lparen") {
      rule = this.parseThreshold();
    } else {
      if (first.kind === "end") throw new LineError(first.column, `missing expression after ${target.text}' =`);
      rule = this.parseOr();
      const deep = firstTooDeep(rule, MAX_NESTING_DEPTH);
      if (deep) throw new LineError(deep.pos!.column, TOO_DEEP, "TOO_DEEP");
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
    if (t.text === PROTOTYPE_KEY)
      throw new LineError(t.column, `"${PROTOTYPE_KEY}" cannot name a node (JavaScript objects treat it specially)`);
  }

  /** The chain of one operator, kept flat: `a & b & c` is one node with three operands. Precedence is the order
   * of CHAIN_OPERATORS (or, then xor, then and), whose operands are the chains of the next one, then unary terms. */
  private parseChain(level: number): Expr {
    const op = CHAIN_OPERATORS[level]!;
    const first = this.parseOperand(level);
    const t = this.peek();
    if (t.kind !== op) return first;
    const args = [first];
    while (this.peek().kind === op) {
      this.next();
      args.push(this.parseOperand(level));
    }
    return { kind: op, args, pos: this.pos(t) };
  }

  private parseOperand(level: number): Expr {
    return level + 1 < CHAIN_OPERATORS.length ? this.parseChain(level + 1) : this.parseUnary();
  }

  private parseOr(): Expr {
    return this.parseChain(0);
  }

  /** Opens one `not` or parenthesis; nesting is bounded so that hostile input cannot exhaust the call stack. */
  private enter(t: Token): void {
    if (++this.depth > MAX_NESTING_DEPTH) throw new LineError(t.column, TOO_DEEP, "TOO_DEEP");
  }

  private parseUnary(): Expr {
    const t = this.peek();
    if (t.kind !== "not") return this.parseAtom();
    this.enter(t);
    this.next();
    const arg = this.parseUnary();
    this.depth--;
    return { kind: "not", arg, pos: this.pos(t) };
  }

  private parseAtom(): Expr {
    const t = this.next();
    switch (t.kind) {
      case "name":
        if (t.text.toLowerCase() === "threshold") {
          throw new LineError(t.column, `threshold(...) must be the whole right side of a rule`);
        }
        if (t.text === PROTOTYPE_KEY) this.checkName(t);
        return { kind: "var", name: t.text, pos: this.pos(t) };
      case "number":
        if (t.text !== "0" && t.text !== "1")
          throw new LineError(t.column, `constant ${showInput(t.text)} is not Boolean; use 0 or 1`);
        return { kind: "const", value: t.text === "1" ? 1 : 0, pos: this.pos(t) };
      case "lparen": {
        this.enter(t);
        const inner = this.parseOr();
        const close = this.peek();
        if (close.kind !== "rparen")
          throw new LineError(close.column, `missing ")" to close "(" at column ${t.column}`);
        this.next();
        this.depth--;
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
    if (!Number.isSafeInteger(value)) throw new LineError(n.column, `number ${showInput(n.text)} is too large`);
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
          throw new LineError(value.column, `tie must be keep or zero, found "${showInput(value.text)}"`);
        tie = v;
      } else {
        throw new LineError(key.column, `unknown threshold option "${showInput(key.text)}"; use offset or tie`);
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

const isBlank = (c: string | undefined) => c === " " || c === "\t" || c === "\r";
const isNameChar = (c: string | undefined) =>
  c !== undefined && ((c >= "A" && c <= "Z") || (c >= "a" && c <= "z") || (c >= "0" && c <= "9") || c === "_");

/**
 * The target and its column when a line starts like `Name' =` or `Name =`, read without the tokenizer, so that a
 * duplicate is found even when the rest of either line is faulty. A plain scan: a regular expression with two
 * optional blank runs would backtrack quadratically on a long run of blanks.
 */
function targetOf(line: string): { name: string; column: number } | null {
  let i = 0;
  while (isBlank(line[i]) || line[i] === "\f" || line[i] === "\v") i++;
  const start = i;
  const c = line[i];
  if (c === undefined || !isNameChar(c) || (c >= "0" && c <= "9")) return null;
  while (isNameChar(line[i])) i++;
  const end = i;
  while (isBlank(line[i])) i++;
  if (line[i] === "'") i++;
  while (isBlank(line[i])) i++;
  return line[i] === "=" ? { name: line.slice(start, end), column: start + 1 } : null;
}

/** Line and column of a character offset (for the size limit, which is checked before lines are read). */
function positionAt(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  for (let i = text.indexOf("\n"); i >= 0 && i < offset; i = text.indexOf("\n", i + 1)) {
    line++;
    lineStart = i + 1;
  }
  return { line, column: offset - lineStart + 1 };
}

/** Regulators a rule reads, as compileDefinition counts them (a threshold rule with tie keep also reads itself). */
function regulatorCount(name: string, rule: RuleSyntax): number {
  const reads = new Set<string>();
  if (rule.kind === "threshold") {
    for (const t of rule.terms) reads.add(t.node);
    if (rule.tie === "keep") reads.add(name);
  } else
    forEachSubexpression(rule, (e) => {
      if (e.kind === "var") reads.add(e.name);
    });
  return reads.size;
}

/**
 * Parse rule text, collecting the first errors (one per faulty line, plus duplicate and undefined nodes) and counting
 * the rest. A byte order mark at the start is skipped; columns count from the character after it.
 */
export function parseRuleText(text: string): RuleTextResult {
  const errors = new ErrorList();
  const rules: ParsedRule[] = [];
  const done = (): RuleTextResult => ({
    definition:
      errors.count === 0 ? { nodes: rules.map((r) => ({ name: r.name, rule: stripPositions(r.rule) })) } : null,
    errors: errors.errors,
    moreErrors: errors.moreErrors,
    rules,
  });
  if (text.length > MAX_RULE_TEXT_CHARS) {
    const at = positionAt(text, MAX_RULE_TEXT_CHARS);
    errors.add(
      at.line,
      at.column,
      `the text has ${text.length} characters; rule text may have at most ${MAX_RULE_TEXT_CHARS} (8 MiB)`,
      "TOO_LARGE",
    );
    return done();
  }

  // Targets are read from every line whose start looks like `Name' =`, so a duplicate is found even when one of
  // the two lines has a syntax error further right, and nodes of faulty lines are not reported as undefined.
  const firstTarget = new Map<string, number>();
  let ruleLines = 0;
  const bom = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  for (let lineNo = 1, start = bom; start <= text.length; lineNo++) {
    const newline = text.indexOf("\n", start);
    const end = newline < 0 ? text.length : newline;
    const raw = text.slice(start, end);
    start = end + 1;
    if (raw.length > MAX_RULE_CHARS) {
      errors.add(
        lineNo,
        MAX_RULE_CHARS + 1,
        `this line has ${raw.length} characters; a rule may have at most ${MAX_RULE_CHARS} (4 MiB)`,
        "TOO_LARGE",
      );
      continue;
    }
    const target = targetOf(raw);
    // Every rule line counts, duplicates too, so that neither the errors nor the rules grow past the bound.
    if (target && ++ruleLines > MAX_NODES) {
      errors.add(
        lineNo,
        target.column,
        `the text has more than ${MAX_NODES} rules, the most nodes a model may have; reading stops here`,
        "TOO_LARGE",
      );
      return done();
    }
    try {
      const rule = new LineParser(raw, lineNo).parseRule();
      if (rule) {
        rules.push(rule);
        const reads = regulatorCount(rule.name, rule.rule);
        if (reads > MAX_REGULATORS)
          errors.add(
            lineNo,
            rule.column,
            `${rule.name} reads ${reads} nodes; a node may read at most ${MAX_REGULATORS}`,
            "TOO_LARGE",
          );
      }
    } catch (e) {
      if (e instanceof LineError) errors.add(lineNo, e.column, e.reason, e.code);
      else if (e instanceof TokenError) errors.add(lineNo, e.column, e.reason);
      else throw e;
    }
    if (!target) continue;
    const earlier = firstTarget.get(target.name);
    if (earlier !== undefined)
      errors.add(lineNo, target.column, () => `duplicate rule for ${target.name} (first on line ${earlier})`);
    else firstTarget.set(target.name, lineNo);
  }

  const reported = new Set<string>();
  const undefinedUse = (name: string, line: number, column: number) => {
    if (firstTarget.has(name) || reported.has(name)) return;
    reported.add(name);
    errors.add(
      line,
      column,
      () => `node ${name} is used on line ${line} but has no rule; add \`${name}' = ${name}\` to make it an input`,
    );
  };
  for (const r of rules) {
    if (r.rule.kind === "threshold") for (const t of r.rule.terms) undefinedUse(t.node, t.pos!.line, t.pos!.column);
    else
      forEachSubexpression(r.rule, (e) => {
        if (e.kind === "var") undefinedUse(e.name, e.pos!.line, e.pos!.column);
      });
  }
  if (errors.count === 0 && rules.length === 0)
    errors.add(1, 1, "the text has no rules; write one line per node, e.g. A' = !B");
  return done();
}

/** Parse rule text and return the model, or throw the first ParseError (its message counts the others). */
export function readRuleText(text: string): ModelDefinition {
  const result = parseRuleText(text);
  if (result.definition) return result.definition;
  throw firstErrorCounting(result.errors, result.moreErrors);
}
