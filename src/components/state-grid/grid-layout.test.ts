import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { attractorEntry, gridColumns, gridCsvRows, oscillatingNodes } from "./grid-layout";

const nodes = ["Tide", "Bloom", "Lux", "Ama"];

describe("gridColumns", () => {
  it("puts phenotype markers first, then inputs, then the rest, each in model order", () => {
    const groups = gridColumns(nodes, { grouping: "grouped", order: "model", markers: ["Lux"], inputs: ["Tide"] });
    expect(groups.map((g) => [g.label, g.columns.map((i) => nodes[i])])).toEqual([
      ["markers", ["Lux"]],
      ["inputs", ["Tide"]],
      ["other nodes", ["Bloom", "Ama"]],
    ]);
  });

  it("orders by name within one group when asked", () => {
    const [only] = gridColumns(nodes, { grouping: "model", order: "name" });
    expect(only!.columns.map((i) => nodes[i])).toEqual(["Ama", "Bloom", "Lux", "Tide"]);
  });

  it("shows every node exactly once whatever the grouping and order", () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.string({ minLength: 1, maxLength: 4 }), { minLength: 1, maxLength: 12 }),
        fc.constantFrom("model" as const, "grouped" as const),
        fc.constantFrom("model" as const, "name" as const),
        fc.array(fc.nat(11)),
        fc.array(fc.nat(11)),
        (names, grouping, order, m, inp) => {
          const markers = m.filter((i) => i < names.length).map((i) => names[i]!);
          const inputs = inp.filter((i) => i < names.length).map((i) => names[i]!);
          const shown = gridColumns(names, { grouping, order, markers, inputs }).flatMap((g) => g.columns);
          expect([...shown].sort((a, b) => a - b)).toEqual(names.map((_, i) => i));
        },
      ),
      { seed: 13 },
    );
  });
});

describe("oscillatingNodes", () => {
  it("marks the nodes whose value changes on the cycle", () => {
    expect(oscillatingNodes(["100", "110", "101"])).toEqual([false, true, true]);
    expect(oscillatingNodes(["01"])).toEqual([false, false]);
  });
});

describe("attractorEntry", () => {
  it("names the known attractor the trajectory first reaches and the step it does", () => {
    const attractors = [{ states: ["00"] }, { states: ["10", "01"] }];
    expect(attractorEntry(["11", "10", "01", "10"], attractors)).toEqual({ step: 1, attractor: 1, length: 2 });
  });

  it("without known attractors, finds the cycle from the first revisited state", () => {
    expect(attractorEntry(["000", "001", "011", "111", "011"])).toEqual({ step: 2, attractor: null, length: 2 });
    expect(attractorEntry(["0", "1"])).toBeNull();
  });

  it("agrees with a plain simulation of a random map: entry step and cycle length", () => {
    fc.assert(
      fc.property(
        fc
          .integer({ min: 1, max: 32 })
          .chain((n) => fc.tuple(fc.array(fc.nat(n - 1), { minLength: n, maxLength: n }), fc.nat(n - 1))),
        ([map, start]) => {
          const states: string[] = [];
          let x = start;
          for (let t = 0; t <= 2 * map.length; t++) {
            states.push(String(x));
            x = map[x]!;
          }
          // Reference: walk until a state repeats, remembering when each was first seen.
          const seen: number[] = [];
          let y = start;
          let t = 0;
          while (seen[y] === undefined) {
            seen[y] = t++;
            y = map[y]!;
          }
          expect(attractorEntry(states)).toEqual({ step: seen[y], attractor: null, length: t - seen[y]! });
        },
      ),
      { seed: 7 },
    );
  });
});

describe("gridCsvRows", () => {
  it("writes the columns in the order shown, with notes when any row has one", () => {
    const groups = gridColumns(["a", "b"], { grouping: "grouped", order: "model", markers: ["b"] });
    expect(gridCsvRows(["a", "b"], groups, [{ label: "t=0", state: "10", note: "enters attractor 1" }])).toEqual([
      ["row", "b", "a", "note"],
      ["t=0", "0", "1", "enters attractor 1"],
    ]);
  });
});
