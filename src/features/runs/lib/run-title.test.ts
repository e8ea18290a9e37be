import { describe, expect, it } from "vitest";
import { nothingFoundSentence, runTitle, searchBounds } from "./run-title";

const bloom = { modelId: "00000000-0000-4000-8000-000000000010", modelName: "Glimmerfin bloom switch", revision: 2 };

describe("runTitle", () => {
  it("names what the run did and on which model revision", () => {
    expect(runTitle({ kind: "attractors", params: {}, model: bloom, targetModel: null })).toBe(
      "Attractors of Glimmerfin bloom switch r2",
    );
    expect(
      runTitle({ kind: "node-elimination", params: { mode: "percolate", hold: [] }, model: bloom, targetModel: null }),
    ).toBe("Percolation of constants in Glimmerfin bloom switch r2");
    expect(
      runTitle({ kind: "node-elimination", params: { mode: "all-eligible" }, model: bloom, targetModel: null }),
    ).toBe("Node elimination in Glimmerfin bloom switch r2 (all eligible nodes)");
    expect(
      runTitle({
        kind: "reduction-search",
        params: { search: { mode: "given-target", notion: "block-emulation" } },
        model: bloom,
        targetModel: { ...bloom, modelName: "Pulse", revision: 1 },
      }),
    ).toBe("Block emulation of Pulse r1 by Glimmerfin bloom switch r2");
    expect(
      runTitle({
        kind: "reduction-search",
        params: { search: { mode: "coarse-grain", observe: ["Lux", "Tide"] } },
        model: bloom,
        targetModel: null,
      }),
    ).toBe("Coarse-graining of Glimmerfin bloom switch r2 onto Lux, Tide");
  });

  it("counts the nodes of rule text sent without a model", () => {
    expect(
      runTitle({ kind: "attractors", params: { ruleText: "a' = !b\nb' = !a" }, model: null, targetModel: null }),
    ).toBe("Attractors of rule text (2 nodes)");
  });
});

describe("nothingFoundSentence and searchBounds", () => {
  it("says in words what a block-emulation search did not find, within its bounds", () => {
    const search = { mode: "given-target", notion: "block-emulation", maxBlock: 3, maxTime: 2, allowContext: true };
    expect(nothingFoundSentence(search)).toBe("No block emulation with blocks ≤ 3 at t ≤ 2");
    expect(searchBounds(search).map((b) => `${b.label}: ${b.value}`)).toEqual([
      "Block size: ≤ 3 source nodes per target node",
      "Time scale: t ≤ 2",
      "Context nodes: allowed",
    ]);
  });

  it("says a coarse-graining found nothing because the observed values do not predict themselves", () => {
    expect(nothingFoundSentence({ mode: "coarse-grain", observe: ["a"], time: 1 })).toBe(
      "No coarse-graining onto a at t = 1: their values do not predict themselves",
    );
  });
});
