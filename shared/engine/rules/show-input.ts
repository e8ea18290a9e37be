// How error messages quote what a user sent: control characters, lone surrogates and the invisible characters that
// reorder or hide text are written as \uXXXX escapes (the JavaScript and JSON notation), and long text is cut, so a
// message can neither garble a terminal or a page nor grow with the input.

/**
 * Code points shown escaped: controls (C0, DEL, C1), format characters (Unicode category Cf: the bidirectional
 * controls, zero-width characters, the byte order mark, tag characters) and the line and paragraph separators.
 */
const INVISIBLE = /^[\p{Cc}\p{Cf}\u2028\u2029]$/u;

const hex4 = (code: number) => `\\u${code.toString(16).toUpperCase().padStart(4, "0")}`;

/**
 * `text` as a message may show it: at most `maxChars` code points (then "…"), each invisible character and each
 * half of a surrogate pair that has no other half written as \uXXXX.
 */
export function showInput(text: string, maxChars = 40): string {
  let out = "";
  let shown = 0;
  for (let i = 0; i < text.length; i++) {
    if (shown === maxChars) return `${out}…`;
    const code = text.charCodeAt(i);
    if (code >= 0xd800 && code <= 0xdbff) {
      const next = text.charCodeAt(i + 1);
      if (next >= 0xdc00 && next <= 0xdfff) {
        const pair = text[i]! + text[i + 1]!;
        out += INVISIBLE.test(pair) ? hex4(code) + hex4(next) : pair;
        i++;
      } else out += hex4(code);
    } else if (code >= 0xdc00 && code <= 0xdfff) out += hex4(code);
    else if (INVISIBLE.test(text[i]!)) out += hex4(code);
    else out += text[i]!;
    shown++;
  }
  return out;
}
