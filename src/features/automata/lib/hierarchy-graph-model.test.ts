import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { HierarchyPair } from "@shared/schemas/automata";
import { buildHierarchyGraph } from "./hierarchy-graph-model";

/** Plain reference: reachability by repeated squaring of a boolean matrix over the rules' node ids. */
function closure(nodes: string[], edges: [string, string][]): Set<string> {
  const reach = new Set(edges.map(([a, b]) => `${a}>${b}`));
  let changed = true;
  while (changed) {
    changed = false;
    for (const a of nodes)
      for (const b of nodes)
        for (const c of nodes) {
          if (a !== c && reach.has(`${a}>${b}`) && reach.has(`${b}>${c}`) && !reach.has(`${a}>${c}`)) {
            reach.add(`${a}>${c}`);
            changed = true;
          }
        }
  }
  return reach;
}

const pairArb = fc.array(
  fc.record({
    source: fc.integer({ min: 0, max: 11 }),
    target: fc.integer({ min: 0, max: 11 }),
    minBlock: fc.integer({ min: 1, max: 4 }),
  }),
  { maxLength: 40 },
);
const toPairs = (raw: { source: number; target: number; minBlock: number }[]): HierarchyPair[] =>
  raw.map((p) => ({ ...p, time: p.minBlock, composed: false }));
const identityClasses = Array.from({ length: 256 }, (_, r) => [r]);

describe("buildHierarchyGraph", () => {
  it("buildHierarchyGraph keeps exactly the reachability of the filtered relation between merged nodes", () => {
    fc.assert(
      fc.property(pairArb, fc.integer({ min: 1, max: 4 }), (raw, lo) => {
        const pairs = toPairs(raw);
        const model = buildHierarchyGraph(pairs, identityClasses, {
          minBlock: lo,
          maxBlock: 4,
          bySymmetryClass: false,
        });
        const nodeOf = new Map<number, string>();
        for (const n of model.nodes) for (const r of n.rules) nodeOf.set(r, n.id);
        const ids = model.nodes.map((n) => n.id);
        const inRange = pairs.filter((p) => p.source !== p.target && p.minBlock >= lo);
        const expected = closure(
          ids,
          inRange
            .map((p) => [nodeOf.get(p.source)!, nodeOf.get(p.target)!] as [string, string])
            .filter(([a, b]) => a !== b),
        );
        const drawn = closure(
          ids,
          model.edges.map((e) => [e.source, e.target]),
        );
        expect([...drawn].sort()).toEqual([...expected].sort());
      }),
      { seed: 20261202, numRuns: 200 },
    );
  });

  it("buildHierarchyGraph draws no arrow that the other arrows already imply", () => {
    fc.assert(
      fc.property(pairArb, (raw) => {
        const model = buildHierarchyGraph(toPairs(raw), identityClasses, {
          minBlock: 1,
          maxBlock: 4,
          bySymmetryClass: false,
        });
        const ids = model.nodes.map((n) => n.id);
        const all = model.edges.map((e) => [e.source, e.target] as [string, string]);
        all.forEach((edge, i) => {
          const without = closure(
            ids,
            all.filter((_, j) => j !== i),
          );
          expect(without.has(`${edge[0]}>${edge[1]}`)).toBe(false);
        });
      }),
      { seed: 7, numRuns: 200 },
    );
  });

  it("buildHierarchyGraph merges mutually emulating rules into one node and labels arrows with the least block size", () => {
    const pairs = toPairs([
      { source: 1, target: 2, minBlock: 3 },
      { source: 2, target: 1, minBlock: 2 },
      { source: 2, target: 5, minBlock: 4 },
      { source: 1, target: 5, minBlock: 2 },
    ]);
    const model = buildHierarchyGraph(pairs, identityClasses, { minBlock: 1, maxBlock: 4, bySymmetryClass: false });
    expect(model.nodes.map((n) => [n.label, n.rules])).toEqual([
      ["1 ≡ 2", [1, 2]],
      ["5", [5]],
    ]);
    expect(model.edges).toEqual([{ source: "n1", target: "n5", minBlock: 2, pair: { source: 1, target: 5 } }]);
    expect(model.isolated).toBe(253);
    const alone = buildHierarchyGraph(
      toPairs([
        { source: 3, target: 4, minBlock: 2 },
        { source: 4, target: 3, minBlock: 2 },
      ]),
      identityClasses,
      { minBlock: 1, maxBlock: 4, bySymmetryClass: false },
    );
    expect(alone.nodes.map((n) => n.label)).toEqual(["3 ≡ 4"]);
  });

  it("buildHierarchyGraph on symmetry classes draws one node per class and drops pairs inside a class", () => {
    const classes = [
      [0, 255],
      [1, 127],
      [2, 16, 191, 247],
    ];
    const pairs = toPairs([
      { source: 0, target: 255, minBlock: 1 },
      { source: 1, target: 16, minBlock: 2 },
      { source: 127, target: 247, minBlock: 3 },
    ]);
    const model = buildHierarchyGraph(pairs, classes, { minBlock: 1, maxBlock: 4, bySymmetryClass: true });
    expect(model.nodes.map((n) => [n.label, n.rules])).toEqual([
      ["1", [1, 127]],
      ["2", [2, 16, 191, 247]],
    ]);
    expect(model.edges.map((e) => [e.source, e.target, e.minBlock])).toEqual([["n1", "n2", 2]]);
  });
});
