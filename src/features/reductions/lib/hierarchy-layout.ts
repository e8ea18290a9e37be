// The model hierarchy as a layered drawing: dagre (Sugiyama-style layered layout) puts each reduction's source above
// its target, so bigger models sit above the models they reduce to and every arrow points down. The input is sorted
// first, so the same hierarchy gives the same coordinates on every load whatever order the server sent it in.
import dagre from "@dagrejs/dagre";
import type { HierarchyGraph } from "@shared/schemas/reductions";
import type { GraphScene, SceneEdge, SceneNode } from "@/components/graph/graph-scene";
import { estimateTextWidth, LABEL_FONT_SIZE, LABEL_GAP } from "@/components/graph/label-placement";
import { NODE_COLOUR, QUALITATIVE, MUTED_COLOUR } from "@/components/graph/palette";

type HierarchyNode = HierarchyGraph["nodes"][number];
type HierarchyEdge = HierarchyGraph["edges"][number];

export const NOTION_COLOURS = {
  "block-emulation": QUALITATIVE[0],
  "dynamical-embedding": QUALITATIVE[1],
  "coarse-graining": QUALITATIVE[3],
  "node-elimination": QUALITATIVE[2],
  "constant-percolation": QUALITATIVE[5],
} as const;
export const COMPOSED_COLOUR = "#64748B";
export const NOTION_VERBS = {
  "block-emulation": "emulates",
  "dynamical-embedding": "embeds",
  "coarse-graining": "coarse-grains",
  "node-elimination": "eliminates nodes to",
  "constant-percolation": "percolates to",
} as const;

/** Radius in pixels of a model with this many nodes: the area grows with the node count. */
export const modelRadius = (nodeCount: number) => Math.min(20, 5 + 3 * Math.sqrt(Math.max(1, nodeCount)));

/**
 * Names that tell models apart: a name shared by several models gets its revision, and where name and revision
 * both repeat, the shortest tail of the model id that differs.
 */
export function distinctNames(nodes: readonly HierarchyNode[]): Map<string, string> {
  const byName = new Map<string, HierarchyNode[]>();
  for (const n of nodes) byName.set(n.name, [...(byName.get(n.name) ?? []), n]);
  const out = new Map<string, string>();
  for (const [name, group] of byName) {
    if (group.length === 1) {
      out.set(group[0]!.modelId, name);
      continue;
    }
    for (const n of group) {
      const twins = group.filter((m) => m.revision === n.revision);
      if (twins.length === 1) {
        out.set(n.modelId, `${name} (r${n.revision})`);
        continue;
      }
      let length = 4;
      const tail = (m: HierarchyNode) => m.modelId.replace(/-/g, "").slice(-length);
      while (length < 32 && new Set(twins.map(tail)).size < twins.length) length += 2;
      out.set(n.modelId, `${name} (r${n.revision}, …${tail(n)})`);
    }
  }
  return out;
}

export const edgeLabel = (e: HierarchyEdge) =>
  `${e.isComposed ? "composed: " : ""}${NOTION_VERBS[e.notion]}, t=${e.timeScale}`;

const edgeKey = (e: HierarchyEdge) => `${e.source}|${e.target}|${e.notion}|${e.timeScale}|${e.isComposed}`;

export interface HierarchyLayout {
  scene: GraphScene;
  /** Models joined to no other by an approved reduction. */
  isolated: SceneNode[];
}

export function layoutHierarchy(graph: HierarchyGraph): HierarchyLayout {
  const names = distinctNames(graph.nodes);
  const nodes = [...graph.nodes].sort(
    (a, b) => b.nodeCount - a.nodeCount || a.name.localeCompare(b.name) || a.modelId.localeCompare(b.modelId),
  );
  const edges = [...graph.edges].sort((a, b) => edgeKey(a).localeCompare(edgeKey(b)));
  const linked = new Set(edges.flatMap((e) => [e.source, e.target]));

  const g = new dagre.graphlib.Graph({ multigraph: true });
  g.setGraph({ rankdir: "TB", nodesep: 24, ranksep: 56, edgesep: 16, marginx: 8, marginy: 8 });
  g.setDefaultEdgeLabel(() => ({}));
  const sceneNodes = new Map<string, SceneNode>();
  for (const n of nodes) {
    const r = modelRadius(n.nodeCount);
    const label = `${names.get(n.modelId)!} · ${n.nodeCount} ${n.nodeCount === 1 ? "node" : "nodes"}`;
    sceneNodes.set(n.modelId, { id: n.modelId, label, x: 0, y: 0, size: r, color: NODE_COLOUR });
    if (!linked.has(n.modelId)) continue;
    // the label sits right of the circle; a box as wide on the left keeps the circle at dagre's centre, where
    // dagre routes the arrows
    const half = r + LABEL_GAP + estimateTextWidth(label, LABEL_FONT_SIZE);
    g.setNode(n.modelId, { width: 2 * half, height: Math.max(2 * r, LABEL_FONT_SIZE + 6) });
  }
  edges.forEach((e, i) => {
    const text = edgeLabel(e);
    g.setEdge(
      e.source,
      e.target,
      { width: estimateTextWidth(text, LABEL_FONT_SIZE - 2) + 6, height: LABEL_FONT_SIZE + 2, labelpos: "c" },
      `e${i}`,
    );
  });
  dagre.layout(g);

  for (const id of g.nodes()) {
    const placed = g.node(id);
    const node = sceneNodes.get(id)!;
    node.x = placed.x!;
    node.y = placed.y!;
  }
  const routes = edges.map((e, i) => g.edge({ v: e.source, w: e.target, name: `e${i}` }));
  const ends = edgeEnds(edges, routes, sceneNodes);
  const sceneEdges: SceneEdge[] = edges.map((e, i) => {
    const routed = routes[i]!;
    const verb = NOTION_VERBS[e.notion];
    return {
      id: `e${i}`,
      source: e.source,
      target: e.target,
      color: e.isComposed ? COMPOSED_COLOUR : NOTION_COLOURS[e.notion],
      head: "arrow",
      size: e.isComposed ? 1.5 : 2.5,
      curvature: 0,
      // dagre's first and last points lie on the boxes, which are wide to hold the labels; the arrows instead leave
      // a circle straight down and enter the next straight from above, so no head hides under a label
      points: [ends[i]!.start, ...(routed.points ?? []).slice(1, -1), ends[i]!.end],
      label: edgeLabel(e),
      labelAt: routed.x !== undefined && routed.y !== undefined ? { x: routed.x, y: routed.y } : undefined,
      description: `${names.get(e.source)} ${verb} ${names.get(e.target)} at time scale ${e.timeScale}${e.isComposed ? " (composed from approved reductions, verified)" : ""}`,
    };
  });
  const isolated = nodes
    .filter((n) => !linked.has(n.modelId))
    .map((n) => ({ ...sceneNodes.get(n.modelId)!, color: MUTED_COLOUR }));
  return {
    scene: {
      nodes: nodes.filter((n) => linked.has(n.modelId)).map((n) => sceneNodes.get(n.modelId)!),
      edges: sceneEdges,
    },
    isolated,
  };
}

/**
 * Where each arrow leaves its source and enters its target: just below or above the circle (whichever faces the
 * other node), spread sideways when several arrows share a node so their heads do not land on each other.
 */
function edgeEnds(
  edges: readonly HierarchyEdge[],
  routes: readonly { points?: { x: number; y: number }[] }[],
  nodes: ReadonlyMap<string, SceneNode>,
): { start: { x: number; y: number }; end: { x: number; y: number } }[] {
  const clearance = LABEL_FONT_SIZE / 2 + 6;
  const slots = new Map<string, { index: number; towardX: number }[]>();
  const claim = (node: string, index: number, towardX: number) =>
    (slots.get(node) ?? slots.set(node, []).get(node)!).push({ index, towardX });
  edges.forEach((e, i) => {
    const points = routes[i]!.points ?? [];
    claim(`out:${e.source}`, i, points[1]?.x ?? nodes.get(e.target)!.x);
    claim(`in:${e.target}`, i, points[points.length - 2]?.x ?? nodes.get(e.source)!.x);
  });
  const offset = new Map<string, number>();
  for (const [key, list] of slots) {
    const node = nodes.get(key.slice(key.indexOf(":") + 1))!;
    list.sort((a, b) => a.towardX - b.towardX || a.index - b.index);
    const step = list.length > 1 ? Math.min(8, (1.4 * node.size) / (list.length - 1)) : 0;
    list.forEach((slot, k) => offset.set(`${key}#${slot.index}`, (k - (list.length - 1) / 2) * step));
  }
  return edges.map((e, i) => {
    const s = nodes.get(e.source)!;
    const t = nodes.get(e.target)!;
    const down = t.y >= s.y ? 1 : -1;
    return {
      start: { x: s.x + offset.get(`out:${e.source}#${i}`)!, y: s.y + down * Math.max(s.size + 14, clearance) },
      end: { x: t.x + offset.get(`in:${e.target}#${i}`)!, y: t.y - down * Math.max(t.size + 14, clearance) },
    };
  });
}
