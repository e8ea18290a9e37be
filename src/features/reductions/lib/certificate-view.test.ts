import { describe, expect, it } from "vitest";
import { networkToCertificate } from "@shared/engine/certificates";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import type { Certificate } from "@shared/schemas/reductions";
import { BLOCK_COLOURS, observableInWords, targetRuleText } from "./certificate-view";

describe("observableInWords", () => {
  it("observableInWords says what an observable reads and when it is 1, from its truth table", () => {
    // rows are the inputs as bits, first input lowest: row 3 is A = 1, B = 1
    expect(observableInWords({ target: "X", inputs: ["A", "B"], table: "0001" })).toBe(
      "X reads A and B and is 1 exactly when A & B (& and, | or, ! not)",
    );
    expect(observableInWords({ target: "X", inputs: ["A"], table: "01" })).toBe(
      "X is 1 exactly when A is 1 (it copies A)",
    );
    expect(observableInWords({ target: "X", inputs: ["A"], table: "10" })).toBe(
      "X is 1 exactly when A is 0 (the opposite of A)",
    );
    expect(observableInWords({ target: "X", inputs: ["A", "B"], table: "1111" })).toBe(
      "X is always 1, whatever F does",
    );
    // A or B but not both: the two products of the exclusive or
    expect(observableInWords({ target: "Y", inputs: ["A", "B", "C"], table: "01100110" })).toMatch(
      /^Y reads A, B and C and is 1 exactly when /,
    );
  });
});

describe("targetRuleText", () => {
  it("targetRuleText prints G's rules so that they compile back to the certificate's truth tables", () => {
    const g = compileDefinition(readRuleText("Tk1' = !Tk3\nTk2' = !Tk1\nTk3' = !Tk2 | Tk1 & Tk3\n"));
    const text = targetRuleText({ target: networkToCertificate(g) } as Certificate);
    expect(text.split("\n")[0]).toBe("Tk1' = !Tk3");
    const again = compileDefinition(readRuleText(text));
    expect(again.tables.map((t) => [...t])).toEqual(g.tables.map((t) => [...t]));
  });
});

describe("BLOCK_COLOURS", () => {
  it("BLOCK_COLOURS leaves out black, which would read as a context node set to 1", () => {
    expect(BLOCK_COLOURS).not.toContain("#000000");
    expect(BLOCK_COLOURS).toHaveLength(7);
  });
});
