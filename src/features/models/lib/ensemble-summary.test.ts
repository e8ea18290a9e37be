import { describe, expect, it } from "vitest";
import { ensembleSummary } from "./ensemble-summary";

describe("ensembleSummary", () => {
  it("follows the annealed approximation for K = 2, p = 1/2 and is the same for the same seed", () => {
    // Derrida, Pomeau, Europhysics Letters 1986: for random K = 2 networks the one-step damage is close to
    // 2p(1-p)[1-(1-a)^K]; with 30 members of 40 nodes the sampled mean stays within a few hundredths of it.
    const req = { ruleText: "a' = !b\nb' = a\n", n: 40, k: 2, p: 0.5, members: 30, seed: 5 };
    const s = ensembleSummary(req);
    for (const pt of s.curve) expect(Math.abs(pt.ensemble - pt.annealed)).toBeLessThan(0.06);
    expect(ensembleSummary(req)).toEqual(s);
    expect(s.attractors).toBeNull();
  });

  it("gathers attractor statistics for small members", () => {
    const s = ensembleSummary({ ruleText: "a' = !a\n", n: 6, k: 2, p: 0.5, members: 10, seed: 1 });
    expect(s.attractors!.countDistribution.reduce((a, [, m]) => a + m, 0)).toBe(10);
    expect(s.attractors!.meanCount).toBeGreaterThanOrEqual(1);
  });
});
