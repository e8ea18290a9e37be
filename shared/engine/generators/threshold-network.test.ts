import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { compileDefinition, printRuleText, readRuleText } from "../rules";
import { thresholdNetwork } from "./threshold-network";

describe("thresholdNetwork", () => {
  it("thresholdNetwork gives each node K distinct terms with weights +1 or -1 and the chosen tie", () => {
    const model = thresholdNetwork({ n: 12, k: 3, tie: "zero", random: seedrandom("4601") });
    for (const node of model.nodes) {
      if (node.rule.kind !== "threshold") throw new Error("expected a threshold rule");
      expect(new Set(node.rule.terms.map((t) => t.node)).size).toBe(3);
      expect(node.rule.terms.every((t) => t.weight === 1 || t.weight === -1)).toBe(true);
      expect(node.rule.tie).toBe("zero");
    }
  });

  it("thresholdNetwork draws positive and negative weights about equally often", () => {
    const random = seedrandom("4602");
    let positive = 0;
    let total = 0;
    for (let d = 0; d < 50; d++) {
      for (const node of thresholdNetwork({ n: 20, k: 2, random }).nodes) {
        if (node.rule.kind !== "threshold") continue;
        for (const t of node.rule.terms) ((positive += t.weight > 0 ? 1 : 0), total++);
      }
    }
    expect(Math.abs(positive - total / 2)).toBeLessThan(5 * Math.sqrt(total / 4));
  });

  it("thresholdNetwork models print as rule text and compile, with the node itself read when ties keep", () => {
    const model = thresholdNetwork({ n: 6, k: 2, random: seedrandom("4603") });
    expect(readRuleText(printRuleText(model))).toEqual(model);
    const net = compileDefinition(model);
    net.regulators.forEach((regs, i) => expect(Array.from(regs)).toContain(i));
  });
});
