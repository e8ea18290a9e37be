// A laid-out graph as plain data: what every picture of a graph is drawn from, whether sigma on screen, the SVG
// writer or the PNG made from that SVG. Coordinates are in layout units with y growing downward (as on a page);
// sizes and widths are in pixels.

export type EdgeHead = "arrow" | "bar";

export interface Point {
  x: number;
  y: number;
}

export interface SceneNode {
  id: string;
  label: string;
  x: number;
  y: number;
  /** Radius in pixels. */
  size: number;
  color: string;
}

export interface SceneEdge {
  id: string;
  source: string;
  target: string;
  color: string;
  /** An arrow for activation or emulation, a flat bar for repression. */
  head: EdgeHead;
  /** Line width in pixels. */
  size: number;
  label?: string;
  /** The edge in words for the text alternative, e.g. "Tk1 represses Tk2". */
  description: string;
  /** Bend of a curved edge, as a fraction of its length (0 is straight); see separateParallelEdges. */
  curvature: number;
  /** Bends of a routed edge (from a layered layout), in layout units, strictly between its two ends. */
  points?: Point[];
  /** Direction of a self-loop from its node, in radians (0 points right, π/2 down); see placeSelfLoops. */
  loopAngle?: number;
  /** Where a routed edge's label sits, in layout units. */
  labelAt?: Point;
}

export interface GraphScene {
  nodes: SceneNode[];
  edges: SceneEdge[];
}

export const isSelfLoop = (e: Pick<SceneEdge, "source" | "target">) => e.source === e.target;

/** How far apart, in curvature units, two edges between the same pair of nodes are bent. */
export const PARALLEL_SPACING = 0.25;

/**
 * Bends edges that join the same two nodes (either way round) apart, leaving lone edges straight. Curvature is
 * measured in each edge's own direction, so giving A→B and B→A the same bend puts them on opposite sides; for a
 * group of n edges between A and B the offsets are spread symmetrically around the straight line.
 */
export function separateParallelEdges<E extends Pick<SceneEdge, "source" | "target" | "curvature">>(
  edges: readonly E[],
  spacing = PARALLEL_SPACING,
): E[] {
  const groups = new Map<string, number[]>();
  edges.forEach((e, i) => {
    if (isSelfLoop(e)) return;
    const key = e.source < e.target ? `${e.source}\u0000${e.target}` : `${e.target}\u0000${e.source}`;
    const group = groups.get(key);
    if (group) group.push(i);
    else groups.set(key, [i]);
  });
  const out = edges.map((e) => ({ ...e }));
  for (const members of groups.values()) {
    if (members.length < 2) {
      out[members[0]!]!.curvature = 0;
      continue;
    }
    members.forEach((index, k) => {
      const e = out[index]!;
      // offset in the frame of the lexically smaller end → larger end, flipped for edges running the other way
      const offset = (k - (members.length - 1) / 2) * spacing;
      // an even group has no straight member; bend the pair at least one full spacing apart
      const spread = members.length === 2 ? offset * 2 : offset;
      e.curvature = e.source < e.target ? spread : -spread;
    });
  }
  return out;
}

/**
 * Points each self-loop into the widest empty angle around its node, so it covers neither the node's other edges nor
 * its label (drawn to the right, angle 0).
 */
export function placeSelfLoops(scene: GraphScene): GraphScene {
  const position = new Map(scene.nodes.map((n) => [n.id, n] as const));
  const directions = new Map<string, number[]>(scene.nodes.map((n) => [n.id, [0]] as const));
  for (const e of scene.edges) {
    if (isSelfLoop(e)) continue;
    const s = position.get(e.source);
    const t = position.get(e.target);
    if (!s || !t) continue;
    const firstFromSource = e.points?.[0] ?? t;
    const lastIntoTarget = e.points?.[e.points.length - 1] ?? s;
    (directions.get(s.id) ?? directions.set(s.id, []).get(s.id)!).push(
      Math.atan2(firstFromSource.y - s.y, firstFromSource.x - s.x),
    );
    (directions.get(t.id) ?? directions.set(t.id, []).get(t.id)!).push(
      Math.atan2(lastIntoTarget.y - t.y, lastIntoTarget.x - t.x),
    );
  }
  return {
    nodes: scene.nodes,
    edges: scene.edges.map((e) =>
      isSelfLoop(e) ? { ...e, loopAngle: widestGapMiddle(directions.get(e.source) ?? []) } : e,
    ),
  };
}

/** The middle of the largest angular gap between the given directions; straight up when there are none. */
export function widestGapMiddle(angles: readonly number[]): number {
  if (angles.length === 0) return -Math.PI / 2;
  const sorted = angles.map((a) => (a + 2 * Math.PI) % (2 * Math.PI)).sort((a, b) => a - b);
  let bestGap = -1;
  let bestMiddle = -Math.PI / 2;
  sorted.forEach((a, i) => {
    const next = i + 1 < sorted.length ? sorted[i + 1]! : sorted[0]! + 2 * Math.PI;
    const gap = next - a;
    if (gap > bestGap + 1e-9) {
      bestGap = gap;
      bestMiddle = a + gap / 2;
    }
  });
  const middle = bestMiddle % (2 * Math.PI);
  return middle > Math.PI ? middle - 2 * Math.PI : middle;
}
