// A small, generic directed graph drawn with sigma through @react-sigma/core and laid out with ForceAtlas2 from a
// deterministic circle (same input, same picture). Callers give plain node and edge lists with colours; it knows no
// feature, so block diagrams, hierarchies and wiring sketches can all use it.
import "@react-sigma/core/lib/style.css";
import { SigmaContainer, useLoadGraph, useRegisterEvents } from "@react-sigma/core";
import Graph from "graphology";
import forceAtlas2 from "graphology-layout-forceatlas2";
import { useEffect, useMemo } from "react";

export interface GraphNode {
  id: string;
  label: string;
  color: string;
  size?: number;
  borderLabel?: string;
}
export interface GraphEdge {
  source: string;
  target: string;
  color: string;
  label?: string;
  size?: number;
}

interface NodeAttrs {
  x: number;
  y: number;
  size: number;
  label: string;
  color: string;
}
interface EdgeAttrs {
  size: number;
  color: string;
  label?: string;
  type: string;
}

export function buildGraph(nodes: GraphNode[], edges: GraphEdge[]): Graph<NodeAttrs, EdgeAttrs> {
  const graph = new Graph<NodeAttrs, EdgeAttrs>({ type: "directed", multi: false, allowSelfLoops: false });
  nodes.forEach((n, i) => {
    const angle = (2 * Math.PI * i) / Math.max(1, nodes.length);
    graph.addNode(n.id, {
      x: Math.cos(angle) * 10,
      y: Math.sin(angle) * 10,
      size: n.size ?? 9,
      label: n.label,
      color: n.color,
    });
  });
  for (const e of edges) {
    if (
      e.source === e.target ||
      !graph.hasNode(e.source) ||
      !graph.hasNode(e.target) ||
      graph.hasEdge(e.source, e.target)
    )
      continue;
    graph.addDirectedEdge(e.source, e.target, { size: e.size ?? 2, color: e.color, label: e.label, type: "arrow" });
  }
  if (graph.order > 2 && graph.size > 0) {
    forceAtlas2.assign(graph, {
      iterations: 200,
      settings: { ...forceAtlas2.inferSettings(graph), adjustSizes: true },
    });
  }
  return graph;
}

function Loader({ graph, onNodeClick }: { graph: Graph<NodeAttrs, EdgeAttrs>; onNodeClick?: (id: string) => void }) {
  const loadGraph = useLoadGraph<NodeAttrs, EdgeAttrs>();
  const registerEvents = useRegisterEvents<NodeAttrs, EdgeAttrs>();
  useEffect(() => loadGraph(graph), [loadGraph, graph]);
  useEffect(() => {
    if (onNodeClick) registerEvents({ clickNode: (e) => onNodeClick(e.node) });
  }, [registerEvents, onNodeClick]);
  return null;
}

export interface NetworkGraphProps {
  nodes: GraphNode[];
  edges: GraphEdge[];
  height?: number;
  onNodeClick?: (id: string) => void;
  testId?: string;
}

export function NetworkGraph({ nodes, edges, height = 360, onNodeClick, testId }: NetworkGraphProps) {
  const graph = useMemo(() => buildGraph(nodes, edges), [nodes, edges]);
  return (
    <div
      data-testid={testId}
      className="overflow-hidden rounded-lg border border-slate-200 bg-white"
      style={{ height }}
    >
      <SigmaContainer
        style={{ height: "100%", width: "100%" }}
        settings={{
          // A container can be 0 px wide for a frame while the page lays out (route changes, grids); sigma then
          // throws unless told to wait for the resize that follows.
          allowInvalidContainer: true,
          renderEdgeLabels: true,
          labelFont: '"Inter Variable", sans-serif',
          edgeLabelFont: '"Inter Variable", sans-serif',
          labelSize: 13,
          labelWeight: "600",
          labelRenderedSizeThreshold: 0,
          // Small graphs: show every label rather than thinning them out where they crowd.
          labelDensity: 10,
          labelGridCellSize: 20,
          defaultEdgeType: "arrow",
          stagePadding: 36,
        }}
      >
        <Loader graph={graph} onNodeClick={onNodeClick} />
      </SigmaContainer>
    </div>
  );
}
