import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { analyseSynchronous, attractorsAsText } from "../state-graph";
import { randomNK } from "../update/random-networks.test-support";
import { YEAST_NAMES, yeastCellCycle } from "../state-graph/yeast-cell-cycle.test-support";
import { groupByPhenotype, phenotypeLabel } from "./index";

describe("phenotype", () => {
  it("phenotypeLabel reads fixed values and oscillating markers of a cycle", () => {
    expect(phenotypeLabel(["100", "110"], [0, 1, 2], ["A", "B", "C"])).toEqual({
      pattern: ["1", "~", "0"],
      label: "A=1 B~ C=0",
    });
  });

  it("phenotypeLabel gives a marker 0 or 1 exactly when it is constant on the attractor, and fixed points never oscillate", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 8 }), fc.integer({ min: 1, max: 3 }), fc.integer(), (n, k, seed) => {
        const names = Array.from({ length: n }, (_, i) => `g${i}`);
        const markers = Array.from({ length: n }, (_, i) => i);
        for (const a of attractorsAsText(analyseSynchronous(randomNK(n, k, seed)))) {
          const { pattern } = phenotypeLabel(a.states, markers, names);
          markers.forEach((m, q) => {
            const values = new Set(a.states.map((s) => s[m]));
            expect(pattern[q]).toBe(values.size === 2 ? "~" : [...values][0]);
          });
          if (a.length === 1) expect(pattern.includes("~")).toBe(false);
        }
      }),
      { seed: 61, numRuns: 60 },
    );
  });

  it("groupByPhenotype puts every attractor in exactly one group", () => {
    const attractors = attractorsAsText(analyseSynchronous(randomNK(10, 2, 6)));
    const groups = groupByPhenotype(
      attractors,
      [0, 3],
      Array.from({ length: 10 }, (_, i) => `g${i}`),
    );
    expect(groups.flatMap((g) => g.attractors).sort((a, b) => a - b)).toEqual(attractors.map((_, i) => i));
  });

  it("phenotypeLabel reads the biggest yeast cell-cycle attractor as the G1 state, Cdh1 and Sic1 on and Clb1,2 off", () => {
    // Li et al., "The yeast cell-cycle network is robustly designed", PNAS 2004: the fixed point with the largest
    // basin is the stationary G1 state, in which only Cdh1 and Sic1 are active (value from memory).
    const [g1] = attractorsAsText(analyseSynchronous(yeastCellCycle()));
    const markers = ["Cdh1", "Sic1", "Clb12"].map((m) => YEAST_NAMES.indexOf(m));
    expect(phenotypeLabel(g1!.states, markers, YEAST_NAMES).label).toBe("Cdh1=1 Sic1=1 Clb12=0");
  });
});
