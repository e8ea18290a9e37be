// ForceAtlas2 positions for a small graph, from a deterministic circle and a fixed number of iterations, so the same
// graph is always laid out the same way. Self-loops and repeated edges do not change a force layout; they are dropped.
import Graph from "graphology";
import forceAtlas2 from "graphology-layout-forceatlas2";
import type { Point } from "./graph-scene";

export function forceLayout(
  nodes: readonly { id: string; size: number }[],
  edges: readonly { source: string; target: string }[],
  iterations = 300,
): Map<string, Point> {
  const graph = new Graph({ type: "directed", multi: false, allowSelfLoops: false });
  nodes.forEach((node, i) => {
    const angle = (2 * Math.PI * i) / Math.max(1, nodes.length);
    graph.addNode(node.id, { x: Math.cos(angle) * 10, y: Math.sin(angle) * 10, size: node.size });
  });
  for (const e of edges) {
    if (
      e.source !== e.target &&
      graph.hasNode(e.source) &&
      graph.hasNode(e.target) &&
      !graph.hasEdge(e.source, e.target)
    )
      graph.addEdge(e.source, e.target);
  }
  if (graph.order > 2 && graph.size > 0) {
    forceAtlas2.assign(graph, { iterations, settings: { ...forceAtlas2.inferSettings(graph), adjustSizes: true } });
  }
  const out = new Map<string, Point>();
  graph.forEachNode((id, a) => out.set(id, { x: a.x as number, y: a.y as number }));
  return out;
}
