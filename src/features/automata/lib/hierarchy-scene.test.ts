import { describe, expect, it } from "vitest";
import type { HierarchyPair } from "@shared/schemas/automata";
import { buildHierarchyGraph } from "./hierarchy-graph-model";
import { blockSizeColour, hierarchyScene, LARGEST_COLOURED_BLOCK, MAX_PER_ROW } from "./hierarchy-scene";

const identityClasses = Array.from({ length: 256 }, (_, r) => [r]);

describe("hierarchyScene", () => {
  it("hierarchyScene labels every node and puts emulators above what they emulate", () => {
    // a wide first layer (40 rules onto rule 0) folds over several rows; every node keeps its label
    const pairs: HierarchyPair[] = Array.from({ length: 40 }, (_, i) => ({
      source: i + 1,
      target: 0,
      minBlock: 2 + (i % 3),
      time: 1,
      composed: false,
    }));
    const model = buildHierarchyGraph(pairs, identityClasses, { minBlock: 1, maxBlock: 4, bySymmetryClass: false });
    const scene = hierarchyScene(model);
    expect(scene.nodes).toHaveLength(41);
    for (const n of scene.nodes) expect(n.label).toMatch(/^\d+$/);
    const y = new Map(scene.nodes.map((n) => [n.id, n.y] as const));
    for (const e of scene.edges) expect(y.get(e.source)!).toBeLessThan(y.get(e.target)!);
    const rows = new Set(scene.nodes.filter((n) => n.id !== "n0").map((n) => n.y));
    expect(rows.size).toBe(Math.ceil(40 / MAX_PER_ROW));
    // every pair of nodes on one row is at least one column apart, room for a three-digit label at the drawn scale
    const byRow = new Map<number, number[]>();
    for (const n of scene.nodes) byRow.set(n.y, [...(byRow.get(n.y) ?? []), n.x]);
    for (const xs of byRow.values()) {
      xs.sort((a, b) => a - b);
      for (let i = 1; i < xs.length; i++) expect(xs[i]! - xs[i - 1]!).toBeGreaterThanOrEqual(1 - 1e-9);
    }
    expect(scene.edges.map((e) => e.color)).toEqual(model.edges.map((e) => blockSizeColour(e.minBlock)));
  });

  it("blockSizeColour gives neighbouring block sizes different colours up to the last coloured one", () => {
    for (let k = 1; k < LARGEST_COLOURED_BLOCK; k++) expect(blockSizeColour(k)).not.toBe(blockSizeColour(k + 1));
    expect(blockSizeColour(LARGEST_COLOURED_BLOCK + 3)).toBe(blockSizeColour(LARGEST_COLOURED_BLOCK));
  });
});
