// A coarse-graining whose observables do not close reports the coarsest grouping that does: as many groups as there
// are distinct orbit words of the observables (checked against a plain walk), its dynamics as listed, and the
// network on ceil(log2 groups) nodes, which must step exactly as the list says.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { successorsOfNetwork } from "@shared/engine/emulation";
import { compileRuleText, mergeSearch, runSearchShard } from "./search-plan";

function coarseGrainingOf(sourceRuleText: string, observe: string[]) {
  const p = {
    search: { mode: "coarse-grain" as const, sourceModelId: crypto.randomUUID(), observe, time: 1 },
    sourceRevisionId: crypto.randomUUID(),
    targetRevisionId: null,
    sourceRuleText,
    targetRuleText: null,
  };
  return mergeSearch(p, [runSearchShard(p, { range: null }, { shouldStop: () => false })]);
}

/** Reference (node k is bit k of a state index): states are alike when the observed node shows the same values along their whole orbit. */
function orbitWordCount(ruleText: string, observed: number): number {
  const succ = successorsOfNetwork(compileRuleText(ruleText));
  const words = new Set<string>();
  for (let x = 0; x < succ.length; x++) {
    let word = "";
    let y = x;
    for (let t = 0; t <= 2 * succ.length; t++) {
      word += (y >> observed) & 1;
      y = succ[y]!;
    }
    words.add(word);
  }
  return words.size;
}

describe("mergeSearch for a coarse-graining that does not close", () => {
  const rule = fc.constantFrom("a", "b", "c", "!a", "!b", "!c", "a & b", "b | !c", "a & !c", "a ^ b");

  it("reports the coarsest grouping, its dynamics and a network on ceil(log2 groups) nodes that steps as listed", () => {
    let nonClosing = 0;
    fc.assert(
      fc.property(fc.tuple(rule, rule, rule), ([ra, rb, rc]) => {
        const text = `a' = ${ra}\nb' = ${rb}\nc' = ${rc}\n`;
        const r = coarseGrainingOf(text, ["a"]);
        expect(r.coarsest === null).toBe(r.found);
        if (!r.coarsest) return;
        nonClosing++;
        const { groups, succ, label, ruleText } = r.coarsest;
        expect(groups).toBe(orbitWordCount(text, 0));
        expect(succ).toHaveLength(groups);
        expect(label).toHaveLength(groups);
        const quotient = compileRuleText(ruleText!);
        expect(quotient.names).toHaveLength(Math.max(1, Math.ceil(Math.log2(groups))));
        const quotientSucc = successorsOfNetwork(quotient);
        for (let g = 0; g < groups; g++) expect(quotientSucc[g]).toBe(succ![g]);
      }),
      { seed: 3, numRuns: 80 },
    );
    expect(nonClosing).toBeGreaterThan(0);
  });
});
