import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { networkFromFunctions } from "../network";
import { analyseSynchronous } from "../state-graph";
import { networkSensitivity } from "../structure";
import { randomNK } from "../update/random-networks.test-support";
import { annealedDamage, attractorStatistics, derridaCurve } from "./index";

describe("ensembles", () => {
  it("attractorStatistics gathers each member's exact attractors into count and length distributions", () => {
    const family = (seed: number) => randomNK(10, 2, seed);
    const seeds = Array.from({ length: 20 }, (_, i) => i + 100);
    const stats = attractorStatistics(family, seeds);
    expect(stats.countDistribution.reduce((t, [, c]) => t + c, 0)).toBe(20);
    seeds.forEach((seed, q) => {
      const exact = analyseSynchronous(family(seed));
      expect(stats.members[q]).toEqual({
        seed,
        attractorCount: exact.attractors.length,
        lengths: exact.attractors.map((a) => a.length),
      });
    });
    const allLengths = stats.members.flatMap((m) => m.lengths);
    expect(stats.lengthDistribution.reduce((t, [, c]) => t + c, 0)).toBe(allLengths.length);
    expect(stats.meanAttractorLength).toBeCloseTo(allLengths.reduce((a, b) => a + b, 0) / allLengths.length, 12);
    expect(stats.meanAttractorCount).toBeCloseTo(stats.members.reduce((t, m) => t + m.attractorCount, 0) / 20, 12);
  });

  it("annealedDamage has slope 2p(1-p)K at zero, the average sensitivity of the same random family", () => {
    // Derrida and Pomeau, Europhysics Letters 1986, and Shmulevich and Kauffman, PRL 2004: both give 2p(1-p)K.
    const eps = 1e-7;
    expect(annealedDamage(eps, 2, 0.5) / eps).toBeCloseTo(1, 5);
    expect(annealedDamage(eps, 3, 0.3) / eps).toBeCloseTo(2 * 0.3 * 0.7 * 3, 5);
    expect(annealedDamage(0, 3, 0.5)).toBe(0);
  });

  it("derridaCurve of large random NK networks follows the annealed approximation of Derrida and Pomeau (1986)", () => {
    // Quenched N=1000 networks match the annealed map a' = 2p(1-p)[1-(1-a)^K] up to sampling noise.
    for (const [k, p] of [
      [2, 0.5],
      [3, 0.5],
      [4, 0.3],
    ] as const) {
      const nets = [1, 2, 3, 4].map((s) => randomNK(1000, k, `${k}-${p}-${s}`, p));
      const curve = derridaCurve(nets, {
        distances: [0.01, 0.05, 0.1, 0.2, 0.4, 0.7, 1],
        pairs: 25,
        rng: seedrandom(`d${k}`),
      });
      for (const point of curve) expect(Math.abs(point.after - annealedDamage(point.before, k, p))).toBeLessThan(0.02);
      // The curve's initial slope is the average sensitivity (Shmulevich and Kauffman, PRL 2004).
      const mean = nets.reduce((t, net) => t + networkSensitivity(net), 0) / nets.length;
      expect(Math.abs(curve[0]!.after / curve[0]!.before - mean)).toBeLessThan(0.25);
    }
  });

  it("derridaCurve of a network of copy nodes keeps every distance unchanged", () => {
    // Each node copies its left neighbour on a ring: the damage is shifted, never created or destroyed.
    const n = 50;
    const ring = networkFromFunctions(
      Array.from({ length: n }, (_, i) => `r${i}`),
      Array.from({ length: n }, (_, i) => [(i + n - 1) % n]),
      (_node, x) => x[0]!,
    );
    for (const point of derridaCurve([ring], { distances: [0, 0.1, 0.5, 1], pairs: 5, rng: seedrandom("ring") }))
      expect(point.after).toBeCloseTo(point.before, 12);
  });
});
