import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { curvedEdge, headPolygon, selfLoop } from "./edge-geometry";

const distance = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.hypot(a.x - b.x, a.y - b.y);
const point = fc.record({
  x: fc.double({ min: -500, max: 500, noNaN: true }),
  y: fc.double({ min: -500, max: 500, noNaN: true }),
});

describe("edge geometry", () => {
  it("curvedEdge(…, 0) is a straight line whose head touches the target's rim", () => {
    const shape = curvedEdge({ x: 0, y: 0 }, 5, { x: 100, y: 0 }, 8, 0, "arrow", 2);
    expect(shape.path.startsWith("M5 0L")).toBe(true);
    expect(shape.tip.x).toBeCloseTo(100 - 9);
    expect(shape.direction).toEqual({ x: 1, y: 0 });
  });

  it("curvedEdge bends the way @sigma/edge-curve does on screen: control = middle + curvature · (dy, −dx)", () => {
    // from (0,0) to (100,0) with curvature 0.25 the control point is (50, −25): above the line on screen
    const shape = curvedEdge({ x: 0, y: 0 }, 5, { x: 100, y: 0 }, 5, 0.25, "arrow", 2);
    expect(shape.path).toContain("Q50 -25 ");
    expect(shape.middle.y).toBeCloseTo(-12.5);
  });

  it("curvedEdge always ends its head on the target's rim, one pixel out", () => {
    fc.assert(
      fc.property(point, point, fc.double({ min: -0.5, max: 0.5, noNaN: true }), (s, t, c) => {
        fc.pre(distance(s, t) > 40);
        const shape = curvedEdge(s, 6, t, 9, c, "bar", 2);
        expect(distance(shape.tip, t)).toBeCloseTo(10, 6);
      }),
      { seed: 11, numRuns: 200 },
    );
  });

  it("selfLoop leaves and re-enters its own node around the given angle", () => {
    const centre = { x: 10, y: 20 };
    const shape = selfLoop(centre, 8, -Math.PI / 2, "arrow", 2);
    expect(distance(shape.tip, centre)).toBeCloseTo(9);
    // pointing up on screen: the far side of the loop lies above the node
    expect(shape.middle.y).toBeLessThan(centre.y - 8);
    expect(shape.path.startsWith("M")).toBe(true);
    expect(shape.path).toContain("C");
  });

  it("headPolygon draws an arrow as a triangle and a repression as a bar across the line", () => {
    const arrow = headPolygon({ x: 0, y: 0 }, { x: 1, y: 0 }, "arrow", 2);
    const bar = headPolygon({ x: 0, y: 0 }, { x: 1, y: 0 }, "bar", 2);
    expect(arrow).toHaveLength(3);
    expect(bar).toHaveLength(4);
    const barWidth = Math.max(...bar.map((p) => p.y)) - Math.min(...bar.map((p) => p.y));
    const barDepth = Math.max(...bar.map((p) => p.x)) - Math.min(...bar.map((p) => p.x));
    expect(barWidth).toBeGreaterThan(3 * barDepth);
  });
});
