// The interaction graph as a graphology graph for sigma: one node per model node, one edge per regulation, coloured
// and shaped by sign; laid out once with ForceAtlas2 from a deterministic circle so the picture is stable.
import Graph from "graphology";
import forceAtlas2 from "graphology-layout-forceatlas2";
import type { EdgeSign, StructureResult } from "@shared/schemas/models";

export interface WiringNodeAttrs {
  x: number;
  y: number;
  size: number;
  label: string;
  color: string;
  inDegree: number;
  outDegree: number;
  rule: string;
  isInput: boolean;
}
export interface WiringEdgeAttrs {
  size: number;
  color: string;
  type: string;
  sign: EdgeSign;
}

export const signStyle: Record<EdgeSign, { color: string; type: string; label: string }> = {
  positive: { color: "#16a34a", type: "activation", label: "activates" },
  negative: { color: "#dc2626", type: "inhibition", label: "represses" },
  dual: { color: "#9333ea", type: "activation", label: "dual (both, depending on context)" },
  "non-essential": { color: "#94a3b8", type: "activation", label: "read but never matters" },
};

export const NODE_COLOUR = "#334155";

export function buildWiringGraph(structure: StructureResult): Graph<WiringNodeAttrs, WiringEdgeAttrs> {
  const graph = new Graph<WiringNodeAttrs, WiringEdgeAttrs>({ type: "directed", multi: false, allowSelfLoops: true });
  const n = structure.nodes.length;
  structure.nodes.forEach((node, i) => {
    const angle = (2 * Math.PI * i) / Math.max(1, n);
    graph.addNode(node.name, {
      x: Math.cos(angle) * 10,
      y: Math.sin(angle) * 10,
      size: 11 + Math.min(8, node.outDegree),
      label: node.name,
      color: NODE_COLOUR,
      inDegree: node.inDegree,
      outDegree: node.outDegree,
      rule: node.rule,
      isInput: node.isInput,
    });
  });
  for (const e of structure.edges) {
    if (e.source === e.target) continue; // sigma draws no self-loops; the hover panel lists them
    const style = signStyle[e.sign];
    graph.addDirectedEdge(e.source, e.target, { size: 3, color: style.color, type: style.type, sign: e.sign });
  }
  if (graph.order > 2 && graph.size > 0) {
    forceAtlas2.assign(graph, {
      iterations: 300,
      settings: { ...forceAtlas2.inferSettings(graph), adjustSizes: true },
    });
  }
  return graph;
}
