import { describe, expect, it } from "vitest";
import { readRuleText } from "./parse-rule-text";
import { printRuleText } from "./print-rule-text";

describe("printRuleText", () => {
  it("printRuleText writes symbol operators with only the parentheses the tree needs", () => {
    const text = "A' = a AND (b OR c)\nB' = not (a xor b) or c\nC' = a | (b | c)\na' = a\nb' = b\nc' = c\n";
    expect(printRuleText(readRuleText(text))).toBe(
      "A' = a & (b | c)\nB' = !(a ^ b) | c\nC' = a | (b | c)\na' = a\nb' = b\nc' = c\n",
    );
  });

  it("printRuleText writes threshold rules with explicit signs, a non-zero offset and the tie behaviour", () => {
    const model = readRuleText("X' = threshold(2 A, -1 B; tie zero)\nY' = threshold(; offset -1)\nA' = A\nB' = B\n");
    expect(printRuleText(model)).toBe(
      "X' = threshold(+2 A, -1 B; tie zero)\nY' = threshold(; offset -1; tie keep)\nA' = A\nB' = B\n",
    );
  });

  it("printRuleText refuses a node name that rule text cannot hold", () => {
    expect(() => printRuleText({ nodes: [{ name: "two words", rule: { kind: "const", value: 1 } }] })).toThrow(
      /cannot be written/,
    );
  });
});
