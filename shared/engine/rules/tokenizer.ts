// Tokenizer for Emulant rule text: splits one line into words, numbers and symbols with 1-based columns.
// Lexical design follows the usual scanner construction of Aho, Sethi, Ullman, "Compilers: Principles, Techniques,
// and Tools", Addison-Wesley 1986, chapter 3 (longest match, one token kind per lexeme).

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

const WORD_OPERATORS: Record<string, TokenKind> = { and: "and", or: "or", xor: "xor", not: "not" };

const SYMBOLS: Record<string, TokenKind> = {
  "'": "prime",
  "=": "equals",
  "&": "and",
  "|": "or",
  "^": "xor",
  "!": "not",
  "(": "lparen",
  ")": "rparen",
  ",": "comma",
  ";": "semicolon",
  "+": "plus",
  "-": "minus",
};

const isNameStart = (c: string) => (c >= "A" && c <= "Z") || (c >= "a" && c <= "z") || c === "_";
const isDigit = (c: string) => c >= "0" && c <= "9";

/** Tokenize one line (without its newline); a `#` starts a comment that runs to the end of the line. */
export function tokenizeLine(line: string): TokenizeResult {
  const tokens: Token[] = [];
  let i = 0;
  while (i < line.length) {
    const c = line[i]!;
    if (c === "#") break;
    if (c === " " || c === "\t" || c === "\r") {
      i++;
      continue;
    }
    const start = i;
    if (isNameStart(c)) {
      while (i < line.length && (isNameStart(line[i]!) || isDigit(line[i]!))) i++;
      const text = line.slice(start, i);
      tokens.push({ kind: WORD_OPERATORS[text.toLowerCase()] ?? "name", text, column: start + 1 });
      continue;
    }
    if (isDigit(c)) {
      while (i < line.length && isDigit(line[i]!)) i++;
      if (i < line.length && isNameStart(line[i]!)) {
        return {
          ok: false,
          column: start + 1,
          reason: `a name cannot start with a digit ("${line.slice(start).match(/^[A-Za-z0-9_]+/)![0]}")`,
        };
      }
      tokens.push({ kind: "number", text: line.slice(start, i), column: start + 1 });
      continue;
    }
    const symbol = SYMBOLS[c];
    if (symbol) {
      tokens.push({ kind: symbol, text: c, column: start + 1 });
      i++;
      continue;
    }
    return { ok: false, column: start + 1, reason: `unknown character "${c}"` };
  }
  tokens.push({ kind: "end", text: "", column: i + 1 });
  return { ok: true, tokens };
}
