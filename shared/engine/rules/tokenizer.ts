// Tokenizer for Emulant rule text: splits one line into words, numbers and symbols with 1-based columns.
// Lexical design follows the usual scanner construction of Aho, Sethi, Ullman, "Compilers: Principles, Techniques,
// and Tools", Addison-Wesley 1986, chapter 3 (longest match, one token kind per lexeme). Tokens are handed out one at
// a time, so a long line costs no more memory than its syntax tree.
import { MAX_NAME_CHARS } from "./limits";
import { showInput } from "./show-input";

export type TokenKind =
  | "name"
  | "number"
  | "prime"
  | "equals"
  | "and"
  | "or"
  | "xor"
  | "not"
  | "lparen"
  | "rparen"
  | "comma"
  | "semicolon"
  | "plus"
  | "minus"
  | "end";

export interface Token {
  readonly kind: TokenKind;
  readonly text: string;
  /** 1-based column of the first character. */
  readonly column: number;
}

export type TokenizeResult = { ok: true; tokens: Token[] } | { ok: false; column: number; reason: string };

/** A lexical error: where in the line and why (not an Error, so throwing it captures no stack trace). */
export class TokenError {
  constructor(
    readonly column: number,
    readonly reason: string,
  ) {}
}

// Maps, not object literals: a word such as "constructor" must not find an inherited property.
const WORD_OPERATORS: ReadonlyMap<string, TokenKind> = new Map([
  ["and", "and"],
  ["or", "or"],
  ["xor", "xor"],
  ["not", "not"],
]);

const SYMBOLS: ReadonlyMap<string, TokenKind> = new Map([
  ["'", "prime"],
  ["=", "equals"],
  ["&", "and"],
  ["|", "or"],
  ["^", "xor"],
  ["!", "not"],
  ["(", "lparen"],
  [")", "rparen"],
  [",", "comma"],
  [";", "semicolon"],
  ["+", "plus"],
  ["-", "minus"],
]);

const isNameStart = (c: string) => (c >= "A" && c <= "Z") || (c >= "a" && c <= "z") || c === "_";
const isDigit = (c: string) => c >= "0" && c <= "9";
const isNameChar = (c: string) => isNameStart(c) || isDigit(c);

/** Reads the tokens of one line (without its newline) on demand; a `#` starts a comment to the end of the line. */
export class LineScanner {
  private i = 0;
  private readonly ahead: Token[] = [];

  constructor(private readonly line: string) {}

  /** The token `k` places ahead (0: the next one). Throws TokenError at a character no token can start with. */
  peek(k = 0): Token {
    while (this.ahead.length <= k) this.ahead.push(this.scan());
    return this.ahead[k]!;
  }

  next(): Token {
    const t = this.peek();
    this.ahead.shift();
    return t;
  }

  private scan(): Token {
    const line = this.line;
    let i = this.i;
    while (i < line.length && (line[i] === " " || line[i] === "\t" || line[i] === "\r")) i++;
    const start = i;
    if (i >= line.length || line[i] === "#") {
      this.i = i;
      return { kind: "end", text: "", column: start + 1 };
    }
    const c = line[i]!;
    if (isNameStart(c)) {
      while (i < line.length && isNameChar(line[i]!)) i++;
      this.i = i;
      if (i - start > MAX_NAME_CHARS)
        throw new TokenError(
          start + 1,
          `this name has ${i - start} characters; a node name may have at most ${MAX_NAME_CHARS}`,
        );
      const text = line.slice(start, i);
      return { kind: WORD_OPERATORS.get(text.toLowerCase()) ?? "name", text, column: start + 1 };
    }
    if (isDigit(c)) {
      while (i < line.length && isDigit(line[i]!)) i++;
      if (i < line.length && isNameStart(line[i]!)) {
        while (i < line.length && isNameChar(line[i]!)) i++;
        throw new TokenError(
          start + 1,
          `a name cannot start with a digit ("${showInput(line.slice(start, Math.min(i, start + 60)))}")`,
        );
      }
      this.i = i;
      return { kind: "number", text: line.slice(start, i), column: start + 1 };
    }
    const symbol = SYMBOLS.get(c);
    if (symbol) {
      this.i = i + 1;
      return { kind: symbol, text: c, column: start + 1 };
    }
    const char = String.fromCodePoint(line.codePointAt(i)!);
    throw new TokenError(start + 1, `unknown character "${showInput(char)}"`);
  }
}

/** Tokenize one whole line; the parser itself reads through a LineScanner and never holds the whole list. */
export function tokenizeLine(line: string): TokenizeResult {
  const scanner = new LineScanner(line);
  const tokens: Token[] = [];
  try {
    for (;;) {
      const t = scanner.next();
      tokens.push(t);
      if (t.kind === "end") return { ok: true, tokens };
    }
  } catch (e) {
    if (!(e instanceof TokenError)) throw e;
    return { ok: false, column: e.column, reason: e.reason };
  }
}
