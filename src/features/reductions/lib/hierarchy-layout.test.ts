import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { HierarchyGraph } from "@shared/schemas/reductions";
import { estimateTextWidth, LABEL_FONT_SIZE, LABEL_GAP } from "@/components/graph/label-placement";
import { distinctNames, layoutHierarchy } from "./hierarchy-layout";

const notions = ["block-emulation", "dynamical-embedding", "coarse-graining"] as const;

/** A project's hierarchy: reductions only from a model to a later one in the list, so it has no cycle. */
const hierarchyArb: fc.Arbitrary<HierarchyGraph> = fc.integer({ min: 1, max: 9 }).chain((count) =>
  fc
    .record({
      nodes: fc.array(
        fc.record({
          name: fc.constantFrom("Bloom switch", "Tide ring", "Pulse", "Tide clock"),
          revision: fc.integer({ min: 1, max: 2 }),
          nodeCount: fc.integer({ min: 1, max: 30 }),
        }),
        { minLength: count, maxLength: count },
      ),
      edges: fc.array(
        fc.record({
          from: fc.nat(count - 1),
          to: fc.nat(count - 1),
          notion: fc.constantFrom(...notions),
          timeScale: fc.integer({ min: 1, max: 3 }),
          isComposed: fc.boolean(),
        }),
        { maxLength: 14 },
      ),
    })
    .map(({ nodes, edges }) => ({
      nodes: nodes.map((n, i) => ({ ...n, modelId: `00000000-0000-4000-8000-${String(i).padStart(12, "0")}` })),
      edges: [
        ...new Map(
          edges
            .filter((e) => e.from < e.to)
            .map((e) => {
              const edge = {
                source: `00000000-0000-4000-8000-${String(e.from).padStart(12, "0")}`,
                target: `00000000-0000-4000-8000-${String(e.to).padStart(12, "0")}`,
                notion: e.notion,
                timeScale: e.timeScale,
                reductionIds: [],
                isComposed: e.isComposed,
                isVerified: true,
              };
              return [
                `${edge.source}|${edge.target}|${edge.notion}|${edge.timeScale}|${edge.isComposed}`,
                edge,
              ] as const;
            }),
        ).values(),
      ],
    })),
);

const shuffled = <T>(items: readonly T[], seed: number) => {
  const out = [...items];
  let s = seed;
  for (let i = out.length - 1; i > 0; i--) {
    s = (s * 1103515245 + 12345) & 0x7fffffff;
    const j = s % (i + 1);
    [out[i], out[j]] = [out[j]!, out[i]!];
  }
  return out;
};

interface Box {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
  what: string;
}
const overlaps = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;

describe("layoutHierarchy", () => {
  it("layoutHierarchy points every reduction down: its source sits above its target", () => {
    fc.assert(
      fc.property(hierarchyArb, (graph) => {
        const { scene } = layoutHierarchy(graph);
        const y = new Map(scene.nodes.map((n) => [n.id, n.y] as const));
        for (const e of scene.edges) expect(y.get(e.source)!).toBeLessThan(y.get(e.target)!);
      }),
      { seed: 13, numRuns: 100 },
    );
  });

  it("layoutHierarchy gives the same coordinates whatever order the models and reductions arrive in", () => {
    fc.assert(
      fc.property(hierarchyArb, fc.nat(), (graph, seed) => {
        const first = layoutHierarchy(graph);
        const again = layoutHierarchy({ nodes: shuffled(graph.nodes, seed), edges: shuffled(graph.edges, seed + 1) });
        expect(again.scene.nodes).toEqual(first.scene.nodes);
        expect(again.scene.edges.map((e) => [e.source, e.target, e.points, e.labelAt])).toEqual(
          first.scene.edges.map((e) => [e.source, e.target, e.points, e.labelAt]),
        );
      }),
      { seed: 17, numRuns: 60 },
    );
  });

  it("layoutHierarchy places no node label over another label, node or arrow label", () => {
    fc.assert(
      fc.property(hierarchyArb, (graph) => {
        const { scene } = layoutHierarchy(graph);
        const h = LABEL_FONT_SIZE / 2;
        const boxes: Box[] = scene.nodes.map((n) => ({
          x0: n.x - n.size,
          x1: n.x + n.size + LABEL_GAP + estimateTextWidth(n.label),
          y0: n.y - Math.max(n.size, h),
          y1: n.y + Math.max(n.size, h),
          what: n.label,
        }));
        for (const e of scene.edges) {
          if (!e.labelAt) continue;
          const w = estimateTextWidth(e.label!, LABEL_FONT_SIZE - 2) / 2;
          boxes.push({
            x0: e.labelAt.x - w,
            x1: e.labelAt.x + w,
            y0: e.labelAt.y - h,
            y1: e.labelAt.y + h,
            what: e.label!,
          });
        }
        for (let i = 0; i < boxes.length; i++)
          for (let j = i + 1; j < boxes.length; j++)
            expect(overlaps(boxes[i]!, boxes[j]!), `${boxes[i]!.what} over ${boxes[j]!.what}`).toBe(false);
      }),
      { seed: 19, numRuns: 100 },
    );
  });

  it("layoutHierarchy lists models without an approved reduction apart from the drawing", () => {
    const graph: HierarchyGraph = {
      nodes: [
        { modelId: "a", name: "Big", nodeCount: 10, revision: 1 },
        { modelId: "b", name: "Small", nodeCount: 2, revision: 1 },
        { modelId: "c", name: "Alone", nodeCount: 5, revision: 1 },
      ],
      edges: [
        {
          source: "a",
          target: "b",
          notion: "block-emulation",
          timeScale: 1,
          reductionIds: ["r"],
          isComposed: false,
          isVerified: true,
        },
      ],
    };
    const { scene, isolated } = layoutHierarchy(graph);
    expect(scene.nodes.map((n) => n.id)).toEqual(["a", "b"]);
    expect(isolated.map((n) => n.label)).toEqual(["Alone · 5 nodes"]);
    expect(scene.edges[0]!.label).toBe("emulates, t=1");
  });
});

describe("distinctNames", () => {
  it("distinctNames adds the revision, then a piece of the id, until every model reads differently", () => {
    const names = distinctNames([
      { modelId: "00000000-0000-4000-8000-0000000000a1", name: "Tide ring", revision: 1, nodeCount: 3 },
      { modelId: "00000000-0000-4000-8000-0000000000b1", name: "Tide ring", revision: 1, nodeCount: 3 },
      { modelId: "00000000-0000-4000-8000-0000000000c2", name: "Tide ring", revision: 2, nodeCount: 3 },
      { modelId: "00000000-0000-4000-8000-000000000003", name: "Pulse", revision: 1, nodeCount: 1 },
    ]);
    expect([...names.values()]).toEqual(["Tide ring (r1, …00a1)", "Tide ring (r1, …00b1)", "Tide ring (r2)", "Pulse"]);
  });

  it("distinctNames never gives two models the same name", () => {
    fc.assert(
      fc.property(hierarchyArb, (graph) => {
        const names = distinctNames(graph.nodes);
        expect(new Set(names.values()).size).toBe(graph.nodes.length);
      }),
      { seed: 23, numRuns: 200 },
    );
  });
});
