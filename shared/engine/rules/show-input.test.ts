import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { showInput } from "./show-input";

/**
 * Plain reference: split into code points by the string iterator (a lone surrogate stays one element), escape each
 * unpaired surrogate, control, format character and line or paragraph separator by its UTF-16 units.
 */
function referenceShow(text: string, maxChars: number): string {
  const points = [...text];
  const hex = (ch: string) =>
    Array.from({ length: ch.length }, (_, i) => `\\u${ch.charCodeAt(i).toString(16).toUpperCase().padStart(4, "0")}`);
  const shown = points.slice(0, maxChars).map((ch) => {
    const lone = ch.length === 1 && ch.charCodeAt(0) >= 0xd800 && ch.charCodeAt(0) <= 0xdfff;
    return lone || /^[\p{Cc}\p{Cf}\u2028\u2029]$/u.test(ch) ? hex(ch).join("") : ch;
  });
  return shown.join("") + (points.length > maxChars ? "…" : "");
}

describe("showInput", () => {
  it("showInput escapes control characters, lone surrogates and reordering characters as \\uXXXX", () => {
    expect(showInput("a\u0007b\u0000")).toBe("a\\u0007b\\u0000");
    expect(showInput("\uD800x\uDC00")).toBe("\\uD800x\\uDC00");
    expect(showInput("\u202Eevil\u2066")).toBe("\\u202Eevil\\u2066");
    expect(showInput("ok \u{1F600} é")).toBe("ok \u{1F600} é");
  });

  it("showInput cuts long text after maxChars code points without splitting a surrogate pair", () => {
    expect(showInput("x".repeat(100), 5)).toBe("xxxxx…");
    expect(showInput("\u{1F600}".repeat(3), 2)).toBe("\u{1F600}\u{1F600}…");
  });

  it("showInput agrees with a code-point-by-code-point reference on random text", () => {
    const unit = fc.oneof(
      fc.string({ unit: "binary", maxLength: 4 }),
      fc.constantFrom("\u0000", "\u0007", "\u001b", "\u007f", "\u0085", "\u00ad", "\u200b", "\u200e", "\u202e"),
      fc.constantFrom("\u2028", "\u2066", "\ufeff", "\uD800", "\uDFFF", "\u{1F600}", "\u{E0041}", "a", "é"),
    );
    fc.assert(
      fc.property(fc.array(unit, { maxLength: 30 }), fc.integer({ min: 1, max: 50 }), (parts, maxChars) => {
        const text = parts.join("");
        expect(showInput(text, maxChars)).toBe(referenceShow(text, maxChars));
      }),
      { seed: 5101, numRuns: 500 },
    );
  });

  it("showInput never returns a control character or an unpaired surrogate", () => {
    fc.assert(
      fc.property(fc.string({ unit: "binary", maxLength: 200 }), (text) => {
        const shown = showInput(text, 1000);
        // matching control characters is the point of this pattern
        // eslint-disable-next-line no-control-regex
        expect(shown).not.toMatch(/[\u0000-\u001f\u007f-\u009f]/);
        // a well-formed string survives a round trip through UTF-8 unchanged
        expect(new TextDecoder().decode(new TextEncoder().encode(shown))).toBe(shown);
      }),
      { seed: 5102, numRuns: 500 },
    );
  });
});
