import { describe, expect, it } from "vitest";
import { ecaRule, ruleFromNumber } from "../automata";
import { verifyEmulation } from "./index";

describe("verifyEmulation", () => {
  it("verifyEmulation accepts the identity rule 204 emulating itself with any two distinct words", () => {
    expect(verifyEmulation(ecaRule(204), 204, "0110", "1011")).toEqual({ valid: true, failures: [] });
  });

  it("verifyEmulation names the triples that fail, with the word found", () => {
    const check = verifyEmulation(ecaRule(204), 170, "00", "11");
    expect(check.valid).toBe(false);
    // 204 keeps the middle block; 170 would need the right one: triples where b != c fail
    expect(check.failures.map((f) => f.triple)).toEqual(["001", "010", "101", "110"]);
    expect(check.failures[0]).toEqual({ triple: "001", expected: "11", found: "00" });
  });

  it("verifyEmulation accepts the shift rule 170 (next value = right neighbour) emulating itself at t = k and rejects it at t < k, where the middle block straddles two blocks", () => {
    expect(verifyEmulation(ecaRule(170), 170, "001", "110").valid).toBe(true);
    const check = verifyEmulation(ecaRule(170), 170, "000", "111", 2);
    expect(check.valid).toBe(false);
    expect(check.failures[0]).toEqual({ triple: "001", expected: "111", found: "011" });
  });

  it("verifyEmulation rejects equal codewords and a time too long for the radius", () => {
    expect(verifyEmulation(ecaRule(204), 204, "01", "01").valid).toBe(false);
    expect(() => verifyEmulation(ruleFromNumber(2, 1), 204, "010", "101", 2)).toThrow(/does not fit/);
    expect(() => verifyEmulation(ecaRule(204), 204, "01", "101")).toThrow(/equal length/);
  });
});
