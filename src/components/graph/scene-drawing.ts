// A scene turned into pixels: circles, label positions, edge paths and heads, and the box that holds all of it. The
// SVG export and the on-screen SVG view draw this; sigma draws the same scene with the same edge shapes.
import { curvedEdge, headPolygon, routedEdge, selfLoop, type EdgeShape } from "./edge-geometry";
import { isSelfLoop, type EdgeHead, type GraphScene, type Point } from "./graph-scene";
import { estimateTextWidth, LABEL_FONT_SIZE, placeLabel } from "./label-placement";

export interface DrawnNode {
  id: string;
  label: string;
  cx: number;
  cy: number;
  r: number;
  color: string;
  labelX: number;
  labelY: number;
  anchor: "start" | "end" | "middle";
}

export interface DrawnEdge {
  id: string;
  source: string;
  target: string;
  color: string;
  width: number;
  path: string;
  head: EdgeHead;
  headPoints: Point[];
  isLoop: boolean;
  label: { x: number; y: number; text: string } | null;
  description: string;
}

export interface Drawing {
  /** The box holding everything drawn, labels included, in pixels. */
  box: { x: number; y: number; width: number; height: number };
  nodes: DrawnNode[];
  edges: DrawnEdge[];
  fontSize: number;
}

export interface DrawOptions {
  /** Pixels per layout unit; when absent the node centres are fitted into `fit`. */
  scale?: number;
  fit?: { width: number; height: number };
  /** Room kept around the node centres for labels before they flip to the other side, in pixels. */
  labelRoom?: number;
  /** Overrides a node's colour (a state painted on the wiring diagram). */
  colourOf?: (id: string, colour: string) => string;
  /** Labels below the node instead of beside it (short labels on crowded rows). */
  labelsBelow?: boolean;
  fontSize?: number;
}

export function drawScene(scene: GraphScene, options: DrawOptions = {}): Drawing {
  const fontSize = options.fontSize ?? LABEL_FONT_SIZE;
  const xs = scene.nodes.map((n) => n.x);
  const ys = scene.nodes.map((n) => n.y);
  const minX = xs.length ? Math.min(...xs) : 0;
  const minY = ys.length ? Math.min(...ys) : 0;
  const spanX = xs.length ? Math.max(...xs) - minX : 0;
  const spanY = ys.length ? Math.max(...ys) - minY : 0;
  const fit = options.fit ?? { width: 720, height: 480 };
  const scale =
    options.scale ?? Math.min(spanX > 0 ? fit.width / spanX : Infinity, spanY > 0 ? fit.height / spanY : Infinity, 60);
  const project = (p: Point): Point => ({ x: (p.x - minX) * scale, y: (p.y - minY) * scale });
  const room = options.labelRoom ?? 40;
  const left = -room;
  const right = spanX * scale + room;

  const nodes: DrawnNode[] = scene.nodes.map((n) => {
    const c = project(n);
    const colour = options.colourOf ? options.colourOf(n.id, n.color) : n.color;
    if (options.labelsBelow)
      return {
        id: n.id,
        label: n.label,
        cx: c.x,
        cy: c.y,
        r: n.size,
        color: colour,
        labelX: c.x,
        labelY: c.y + n.size + fontSize * 0.9,
        anchor: "middle",
      };
    const placed = placeLabel(c.x, n.size, estimateTextWidth(n.label, fontSize), left, right);
    return {
      id: n.id,
      label: n.label,
      cx: c.x,
      cy: c.y,
      r: n.size,
      color: colour,
      labelX: placed.x,
      labelY: c.y,
      anchor: placed.anchor,
    };
  });
  const byId = new Map(nodes.map((n) => [n.id, n] as const));

  const edges: DrawnEdge[] = [];
  for (const e of scene.edges) {
    const s = byId.get(e.source);
    const t = byId.get(e.target);
    if (!s || !t) continue;
    let shape: EdgeShape;
    if (isSelfLoop(e)) shape = selfLoop({ x: s.cx, y: s.cy }, s.r, e.loopAngle ?? -Math.PI / 2, e.head, e.size);
    else if (e.points?.length)
      shape = routedEdge({ x: s.cx, y: s.cy }, s.r, e.points.map(project), { x: t.cx, y: t.cy }, t.r, e.head, e.size);
    else shape = curvedEdge({ x: s.cx, y: s.cy }, s.r, { x: t.cx, y: t.cy }, t.r, e.curvature, e.head, e.size);
    const labelAt = e.labelAt ? project(e.labelAt) : shape.middle;
    edges.push({
      id: e.id,
      source: e.source,
      target: e.target,
      color: e.color,
      width: e.size,
      path: shape.path,
      head: e.head,
      headPoints: headPolygon(shape.tip, shape.direction, e.head, e.size),
      isLoop: isSelfLoop(e),
      label: e.label ? { x: labelAt.x, y: labelAt.y, text: e.label } : null,
      description: e.description,
    });
  }
  return { box: contentBox(nodes, edges, fontSize), nodes, edges, fontSize };
}

/** Everything drawn, padded: circles, labels (estimated widths), edge paths' points and heads, edge labels. */
function contentBox(nodes: DrawnNode[], edges: DrawnEdge[], fontSize: number): Drawing["box"] {
  let x0 = Infinity,
    y0 = Infinity,
    x1 = -Infinity,
    y1 = -Infinity;
  const take = (x: number, y: number) => {
    x0 = Math.min(x0, x);
    y0 = Math.min(y0, y);
    x1 = Math.max(x1, x);
    y1 = Math.max(y1, y);
  };
  for (const n of nodes) {
    take(n.cx - n.r, n.cy - n.r);
    take(n.cx + n.r, n.cy + n.r);
    const w = estimateTextWidth(n.label, fontSize);
    const lx = n.anchor === "start" ? n.labelX : n.anchor === "end" ? n.labelX - w : n.labelX - w / 2;
    take(lx, n.labelY - fontSize * 0.7);
    take(lx + w, n.labelY + fontSize * 0.7);
  }
  for (const e of edges) {
    // path coordinates include Bézier control points, which bound the curve
    const numbers = e.path.match(/-?\d+(\.\d+)?/g)?.map(Number) ?? [];
    for (let i = 0; i + 1 < numbers.length; i += 2) take(numbers[i]!, numbers[i + 1]!);
    for (const p of e.headPoints) take(p.x, p.y);
    if (e.label) {
      const w = estimateTextWidth(e.label.text, fontSize - 2);
      take(e.label.x - w / 2, e.label.y - fontSize);
      take(e.label.x + w / 2, e.label.y + fontSize);
    }
  }
  if (!Number.isFinite(x0)) return { x: 0, y: 0, width: 100, height: 60 };
  const pad = 12;
  return { x: x0 - pad, y: y0 - pad, width: x1 - x0 + 2 * pad, height: y1 - y0 + 2 * pad };
}
