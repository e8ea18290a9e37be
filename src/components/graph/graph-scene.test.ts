import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { curvedEdge } from "./edge-geometry";
import { placeSelfLoops, separateParallelEdges, widestGapMiddle, type SceneEdge } from "./graph-scene";

const edge = (source: string, target: string): SceneEdge => ({
  id: `${source}->${target}`,
  source,
  target,
  color: "#000",
  head: "arrow",
  size: 2,
  curvature: 0,
  description: "",
});

/** Angular distance between two directions, in [0, π]. */
const angularDistance = (a: number, b: number) => {
  const d = Math.abs(a - b) % (2 * Math.PI);
  return d > Math.PI ? 2 * Math.PI - d : d;
};

describe("separateParallelEdges", () => {
  it("separateParallelEdges leaves a lone edge straight and bends a two-way pair to opposite sides", () => {
    const [lone, there, back] = separateParallelEdges([edge("A", "C"), edge("A", "B"), edge("B", "A")]);
    expect(lone!.curvature).toBe(0);
    expect(there!.curvature).not.toBe(0);
    // the same bend in each edge's own direction puts the two curves on opposite sides of the line A–B
    expect(back!.curvature).toBe(there!.curvature);
    const a = { x: 0, y: 0 };
    const b = { x: 100, y: 0 };
    const forward = curvedEdge(a, 5, b, 5, there!.curvature, "arrow", 2).middle;
    const backward = curvedEdge(b, 5, a, 5, back!.curvature, "arrow", 2).middle;
    expect(Math.sign(forward.y)).toBe(-Math.sign(backward.y));
  });

  it("separateParallelEdges gives every edge between the same two nodes its own curve", () => {
    const nodes = ["A", "B", "C", "D"];
    const pairs = fc.array(
      fc.tuple(fc.constantFrom(...nodes), fc.constantFrom(...nodes)).filter(([s, t]) => s !== t),
      { maxLength: 12 },
    );
    fc.assert(
      fc.property(pairs, (raw) => {
        const position = new Map(nodes.map((n, i) => [n, { x: Math.cos(i) * 100, y: Math.sin(i) * 100 }] as const));
        const bent = separateParallelEdges(raw.map(([s, t]) => edge(s, t)));
        // the middle of each drawn curve: two edges between the same nodes must never share it
        const middles = bent.map((e) => {
          const m = curvedEdge(position.get(e.source)!, 5, position.get(e.target)!, 5, e.curvature, "arrow", 2).middle;
          return `${[e.source, e.target].sort().join("")}:${m.x.toFixed(3)},${m.y.toFixed(3)}`;
        });
        const groups = new Map<string, number>();
        for (const e of bent) {
          const key = [e.source, e.target].sort().join("");
          groups.set(key, (groups.get(key) ?? 0) + 1);
        }
        const distinctPerGroup = new Map<string, Set<string>>();
        for (const m of middles) {
          const key = m.slice(0, 2);
          distinctPerGroup.set(key, (distinctPerGroup.get(key) ?? new Set()).add(m));
        }
        for (const [key, count] of groups) expect(distinctPerGroup.get(key)!.size).toBe(count);
        for (const e of bent) if (groups.get([e.source, e.target].sort().join(""))! === 1) expect(e.curvature).toBe(0);
      }),
      { seed: 20261203, numRuns: 300 },
    );
  });
});

describe("widestGapMiddle", () => {
  it("widestGapMiddle points straight up when nothing else leaves the node", () => {
    expect(widestGapMiddle([])).toBeCloseTo(-Math.PI / 2);
  });

  it("widestGapMiddle is as far from every edge as the best of 3600 sampled directions", () => {
    const angles = fc.array(fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), { minLength: 1, maxLength: 8 });
    fc.assert(
      fc.property(angles, (dirs) => {
        const clearance = (a: number) => Math.min(...dirs.map((d) => angularDistance(a, d)));
        let best = 0;
        for (let i = 0; i < 3600; i++) best = Math.max(best, clearance((2 * Math.PI * i) / 3600));
        expect(clearance(widestGapMiddle(dirs))).toBeGreaterThanOrEqual(best - 1e-3);
      }),
      { seed: 7, numRuns: 200 },
    );
  });

  it("placeSelfLoops turns a loop away from the node's neighbour and its label", () => {
    const scene = placeSelfLoops({
      nodes: [
        { id: "A", label: "A", x: 0, y: 0, size: 8, color: "#000" },
        { id: "B", label: "B", x: 0, y: 10, size: 8, color: "#000" },
      ],
      edges: [edge("A", "B"), edge("A", "A")],
    });
    // B lies below (angle π/2) and the label to the right (angle 0): the loop takes the middle of the rest
    expect(scene.edges[1]!.loopAngle!).toBeCloseTo(-(3 * Math.PI) / 4);
  });
});
