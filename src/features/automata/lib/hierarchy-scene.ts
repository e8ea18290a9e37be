// Where the automaton hierarchy's nodes go: one band of rows per layer (emulators above what they emulate), the
// order inside a band taken from a ForceAtlas2 run so related nodes sit near each other, and bands with many nodes
// folded zig-zag over several rows so every label has room. Arrow colours come from the colour-blind-safe palette.
import { forceLayout } from "@/components/graph/force-layout";
import { separateParallelEdges, type GraphScene, type SceneEdge } from "@/components/graph/graph-scene";
import { NODE_COLOUR, qualitativeColour, SIGN_COLOURS } from "@/components/graph/palette";
import type { HierarchyGraphModel } from "./hierarchy-graph-model";

/** The largest block size with a colour of its own; every larger k shares the palette's last colour. */
export const LARGEST_COLOURED_BLOCK = 9;

/**
 * Arrow colour for a least block size k. k = 1 (a rule that is a renaming of another) is neutral grey; from k = 2 on
 * the palette runs in order, so the common small block sizes get its strongest colours and only k ≥ 9 its yellow.
 */
export const blockSizeColour = (minBlock: number) =>
  minBlock <= 1 ? SIGN_COLOURS["non-essential"] : qualitativeColour(minBlock - 2);

/** Sideways spacing, in layout units, between neighbours on one drawn row. */
const COLUMN = 1;
/** Vertical distance between the bands of two layers. */
const ROW = 1;
/** Layers with more nodes than this are folded over several rows so that labels do not collide. */
export const MAX_PER_ROW = 14;

export const nodeName = (rules: readonly number[], label: string) =>
  rules.length > 1 && !label.includes("≡") ? `rule ${label} (class of ${rules.length})` : `rule ${label}`;

export function hierarchyScene(model: HierarchyGraphModel): GraphScene {
  const sized = model.nodes.map((n) => ({ id: n.id, size: Math.min(12, 5 + 1.5 * Math.sqrt(n.rules.length)) }));
  const force = forceLayout(sized, model.edges, 150);
  const position = new Map<string, { x: number; y: number }>();
  const byLayer = new Map<number, string[]>();
  for (const n of model.nodes) byLayer.set(n.layer, [...(byLayer.get(n.layer) ?? []), n.id]);
  let y = 0;
  for (const layer of [...byLayer.keys()].sort((a, b) => a - b)) {
    const ids = byLayer.get(layer)!.sort((p, q) => force.get(p)!.x - force.get(q)!.x || p.localeCompare(q));
    const rows = Math.ceil(ids.length / MAX_PER_ROW);
    const step = Math.min((COLUMN * MAX_PER_ROW) / ids.length, 2 * COLUMN);
    ids.forEach((id, i) => position.set(id, { x: (i - (ids.length - 1) / 2) * step, y: y + (i % rows) * ROW * 0.5 }));
    y += ROW * (1 + 0.5 * (rows - 1));
  }
  const label = new Map(model.nodes.map((n) => [n.id, n.label] as const));
  const edges: SceneEdge[] = model.edges.map((e) => ({
    id: `${e.source}->${e.target}`,
    source: e.source,
    target: e.target,
    color: blockSizeColour(e.minBlock),
    head: "arrow",
    size: 1.5,
    curvature: 0,
    label: `k=${e.minBlock}`,
    description: `${label.get(e.source)} emulates ${label.get(e.target)} with blocks of ${e.minBlock} cells (rule ${e.pair.source} → rule ${e.pair.target})`,
  }));
  return {
    nodes: model.nodes.map((n, i) => ({
      id: n.id,
      label: n.label,
      ...position.get(n.id)!,
      size: sized[i]!.size,
      color: NODE_COLOUR,
    })),
    edges: separateParallelEdges(edges),
  };
}
