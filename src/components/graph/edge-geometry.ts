// The shapes of edges in pixels, y growing downward: curved and routed edges, self-loops and their heads. One module
// for the sigma overlay and the SVG writer, so a loop or a bar looks the same on screen and in an export.
import type { EdgeHead, Point } from "./graph-scene";

export interface EdgeShape {
  /** SVG path data of the line, ending where the head starts. */
  path: string;
  /** The point of the head, on the target's rim. */
  tip: Point;
  /** Unit vector along the line at the tip. */
  direction: Point;
  /** Where a label sits: the middle of the line. */
  middle: Point;
}

const unit = (x: number, y: number): Point => {
  const length = Math.hypot(x, y) || 1;
  return { x: x / length, y: y / length };
};
const fmt = (v: number) => (Math.round(v * 100) / 100).toString();
const pt = (p: Point) => `${fmt(p.x)} ${fmt(p.y)}`;

/** Length of an edge head along the line, for a line of the given width. */
export const headLength = (width: number) => Math.max(7, 3.5 * width);
const barDepth = (width: number) => Math.max(2.5, width * 1.2);
/** How far before the tip the line stops, so it ends inside the head rather than poking through its point. */
const lineShortening = (head: EdgeHead, width: number) =>
  head === "bar" ? barDepth(width) / 2 : headLength(width) * 0.8;

/**
 * A straight or curved edge between two circles. The control point follows @sigma/edge-curve's convention in
 * screen coordinates: middle + curvature · (dy, −dx), so the screen and the export bend an edge the same way.
 */
export function curvedEdge(
  source: Point,
  sourceRadius: number,
  target: Point,
  targetRadius: number,
  curvature: number,
  head: EdgeHead,
  width: number,
): EdgeShape {
  const dx = target.x - source.x;
  const dy = target.y - source.y;
  const control = { x: (source.x + target.x) / 2 + curvature * dy, y: (source.y + target.y) / 2 - curvature * dx };
  const out = unit(control.x - source.x, control.y - source.y);
  const direction = unit(target.x - control.x, target.y - control.y);
  const start = { x: source.x + out.x * sourceRadius, y: source.y + out.y * sourceRadius };
  const tip = { x: target.x - direction.x * (targetRadius + 1), y: target.y - direction.y * (targetRadius + 1) };
  const back = lineShortening(head, width);
  const end = { x: tip.x - direction.x * back, y: tip.y - direction.y * back };
  const middle = {
    x: 0.25 * source.x + 0.5 * control.x + 0.25 * target.x,
    y: 0.25 * source.y + 0.5 * control.y + 0.25 * target.y,
  };
  const path = curvature === 0 ? `M${pt(start)}L${pt(end)}` : `M${pt(start)}Q${pt(control)} ${pt(end)}`;
  return { path, tip, direction, middle };
}

/** An edge routed through bends (a layered layout's polyline), clipped to the two circles. */
export function routedEdge(
  source: Point,
  sourceRadius: number,
  bends: readonly Point[],
  target: Point,
  targetRadius: number,
  head: EdgeHead,
  width: number,
): EdgeShape {
  const first = bends[0] ?? target;
  const last = bends[bends.length - 1] ?? source;
  const out = unit(first.x - source.x, first.y - source.y);
  const direction = unit(target.x - last.x, target.y - last.y);
  const start = { x: source.x + out.x * sourceRadius, y: source.y + out.y * sourceRadius };
  const tip = { x: target.x - direction.x * (targetRadius + 1), y: target.y - direction.y * (targetRadius + 1) };
  const back = lineShortening(head, width);
  const end = { x: tip.x - direction.x * back, y: tip.y - direction.y * back };
  const all = [start, ...bends, end];
  const middle = bends.length
    ? bends[Math.floor((bends.length - 1) / 2)]!
    : { x: (start.x + end.x) / 2, y: (start.y + end.y) / 2 };
  return {
    path:
      `M${pt(start)}` +
      all
        .slice(1)
        .map((p) => `L${pt(p)}`)
        .join(""),
    tip,
    direction,
    middle,
  };
}

/** A self-loop leaving and re-entering a circle of the given radius around `angle`, as a cubic Bézier. */
export function selfLoop(centre: Point, radius: number, angle: number, head: EdgeHead, width: number): EdgeShape {
  const spread = 0.5;
  const reach = Math.max(18, radius * 2.6);
  const at = (a: number, d: number) => ({ x: centre.x + Math.cos(a) * d, y: centre.y + Math.sin(a) * d });
  const start = at(angle - spread, radius);
  const c1 = at(angle - spread * 1.6, radius + reach);
  const c2 = at(angle + spread * 1.6, radius + reach);
  const tip = at(angle + spread, radius + 1);
  const direction = unit(tip.x - c2.x, tip.y - c2.y);
  const back = lineShortening(head, width);
  const end = { x: tip.x - direction.x * back, y: tip.y - direction.y * back };
  const middle = at(angle, radius + reach * 0.75);
  return { path: `M${pt(start)}C${pt(c1)} ${pt(c2)} ${pt(end)}`, tip, direction, middle };
}

/** The head at a tip: an arrow's triangle, or a repression's bar (a thin rectangle across the line). */
export function headPolygon(tip: Point, direction: Point, head: EdgeHead, width: number): Point[] {
  const normal = { x: -direction.y, y: direction.x };
  if (head === "bar") {
    const half = Math.max(6, 3 * width);
    const depth = barDepth(width);
    const back = { x: tip.x - direction.x * depth, y: tip.y - direction.y * depth };
    return [
      { x: tip.x + normal.x * half, y: tip.y + normal.y * half },
      { x: tip.x - normal.x * half, y: tip.y - normal.y * half },
      { x: back.x - normal.x * half, y: back.y - normal.y * half },
      { x: back.x + normal.x * half, y: back.y + normal.y * half },
    ];
  }
  const length = headLength(width);
  const half = Math.max(3.5, 1.8 * width);
  const base = { x: tip.x - direction.x * length, y: tip.y - direction.y * length };
  return [
    tip,
    { x: base.x + normal.x * half, y: base.y + normal.y * half },
    { x: base.x - normal.x * half, y: base.y - normal.y * half },
  ];
}

export const polygonPoints = (points: readonly Point[]) => points.map((p) => `${fmt(p.x)},${fmt(p.y)}`).join(" ");
