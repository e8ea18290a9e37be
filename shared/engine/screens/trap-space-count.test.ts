import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { perturbNetwork } from "../perturbation";
import { compileDefinition, readRuleText } from "../rules";
import { trapSpaces } from "../trap-spaces";
import { randomNK } from "../update/random-networks.test-support";
import { trapSpacePhenotypeCount } from "./trap-space-count";

describe("trapSpacePhenotypeCount", () => {
  it("trapSpacePhenotypeCount counts the two fixed points of a toggle switch and the one left by a knock-out (common practice)", () => {
    const net = compileDefinition(readRuleText("A' = !B\nB' = !A\n"));
    expect(trapSpacePhenotypeCount(net, {}, { A: 1 })).toEqual({ total: 2, withPhenotype: 1, complete: true });
    expect(trapSpacePhenotypeCount(net, { B: 0 }, { A: 1 })).toEqual({ total: 1, withPhenotype: 1, complete: true });
    expect(trapSpacePhenotypeCount(net, { A: 0 }, { A: 1 })).toEqual({ total: 1, withPhenotype: 0, complete: true });
  });

  it("trapSpacePhenotypeCount agrees with filtering the minimal trap spaces of the perturbed network by hand", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 7 }), fc.integer(), fc.constantFrom<0 | 1>(0, 1), (n, seed, v) => {
        const net = randomNK(n, 2, seed);
        const got = trapSpacePhenotypeCount(net, { g0: v }, { g1: 1 });
        const perturbed = perturbNetwork(net, v ? { overExpress: [0] } : { knockOut: [0] });
        const all = trapSpaces(perturbed).trapSpaces;
        expect(got.total).toBe(all.length);
        expect(got.withPhenotype).toBe(all.filter((t) => t.pattern[1] === "1").length);
      }),
      { seed: 15, numRuns: 100 },
    );
  });
});
