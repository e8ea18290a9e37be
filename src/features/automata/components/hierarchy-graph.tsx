// The hierarchy drawn with sigma: nodes are rules or symmetry classes (merged when they emulate each other), arrows
// go from emulator to emulated and carry the least block size. Layers come from the longest emulation chain;
// ForceAtlas2 spreads each layer sideways so related nodes sit near each other.
import "@react-sigma/core/lib/style.css";
import { SigmaContainer, useLoadGraph, useRegisterEvents, useSetSettings, useSigma } from "@react-sigma/core";
import Graph from "graphology";
import forceAtlas2 from "graphology-layout-forceatlas2";
import { useEffect, useMemo, useState } from "react";
import type { HierarchyGraphModel } from "../lib/hierarchy-graph-model";

interface NodeAttrs {
  x: number;
  y: number;
  size: number;
  label: string;
  color: string;
  rules: number[];
}
interface EdgeAttrs {
  size: number;
  label: string;
  color: string;
  type: string;
}

const blockColours = ["#0f766e", "#0d9488", "#2563eb", "#7c3aed", "#c026d3", "#db2777", "#ea580c", "#ca8a04"];

export function edgeColour(minBlock: number): string {
  return blockColours[Math.min(blockColours.length - 1, Math.max(0, minBlock - 1))]!;
}

/** Sideways spacing, in graph units, between neighbours on one drawn row. */
const COLUMN = 1;
/** Vertical distance between drawn rows. */
const ROW = 1;
/** Layers with more nodes than this are drawn zig-zag over several rows so that labels do not collide. */
const MAX_PER_ROW = 14;

function buildGraph(model: HierarchyGraphModel): Graph<NodeAttrs, EdgeAttrs> {
  const graph = new Graph<NodeAttrs, EdgeAttrs>({ type: "directed", multi: false });
  model.nodes.forEach((n, i) => {
    graph.addNode(n.id, {
      // a circle start, so ForceAtlas2 begins from distinct positions without any randomness
      x: Math.cos((2 * Math.PI * i) / model.nodes.length),
      y: Math.sin((2 * Math.PI * i) / model.nodes.length),
      size: Math.min(12, 5 + 1.5 * Math.sqrt(n.rules.length)),
      label: n.label,
      color: "#334155",
      rules: n.rules,
    });
  });
  for (const e of model.edges) {
    graph.addDirectedEdge(e.source, e.target, {
      size: 1,
      label: `k=${e.minBlock}`,
      color: edgeColour(e.minBlock),
      type: "arrow",
    });
  }
  if (graph.order > 1) forceAtlas2.assign(graph, { iterations: 150, settings: forceAtlas2.inferSettings(graph) });
  // ForceAtlas2 decides the order within a layer (related nodes end up near each other); the layers themselves
  // are drawn as rows, emulators above what they emulate
  const byLayer = new Map<number, string[]>();
  for (const n of model.nodes) byLayer.set(n.layer, [...(byLayer.get(n.layer) ?? []), n.id]);
  let y = 0;
  for (const layer of [...byLayer.keys()].sort((a, b) => a - b)) {
    const ids = byLayer.get(layer)!.sort((p, q) => graph.getNodeAttribute(p, "x") - graph.getNodeAttribute(q, "x"));
    const rows = Math.ceil(ids.length / MAX_PER_ROW);
    const step = Math.min((COLUMN * MAX_PER_ROW) / ids.length, 2 * COLUMN);
    ids.forEach((id, i) => {
      graph.setNodeAttribute(id, "x", (i - (ids.length - 1) / 2) * step);
      graph.setNodeAttribute(id, "y", -(y + (i % rows) * ROW * 0.5));
    });
    y += ROW * (1 + 0.5 * (rows - 1));
  }
  return graph;
}

function LoadGraph({ graph }: { graph: Graph<NodeAttrs, EdgeAttrs> }) {
  const loadGraph = useLoadGraph<NodeAttrs, EdgeAttrs>();
  useEffect(() => loadGraph(graph), [loadGraph, graph]);
  return null;
}

function Interactions({ highlightRule, onOpenRule }: { highlightRule: number | null; onOpenRule(rule: number): void }) {
  const sigma = useSigma<NodeAttrs, EdgeAttrs>();
  const registerEvents = useRegisterEvents<NodeAttrs, EdgeAttrs>();
  const setSettings = useSetSettings<NodeAttrs, EdgeAttrs>();
  const [hovered, setHovered] = useState<string | null>(null);

  useEffect(() => {
    registerEvents({
      enterNode: (e) => setHovered(e.node),
      leaveNode: () => setHovered(null),
      clickNode: (e) => {
        const rules = sigma.getGraph().getNodeAttribute(e.node, "rules");
        if (rules[0] !== undefined) onOpenRule(rules[0]);
      },
    });
  }, [registerEvents, sigma, onOpenRule]);

  useEffect(() => {
    const graph = sigma.getGraph();
    const searched =
      highlightRule === null ? null : (graph.findNode((_, a) => a.rules.includes(highlightRule)) ?? null);
    const focus = hovered ?? searched;
    const near = new Set<string>();
    if (focus && graph.hasNode(focus)) {
      near.add(focus);
      graph.forEachNeighbor(focus, (n) => near.add(n));
    }
    setSettings({
      nodeReducer: (node, data) => {
        if (!focus) return data;
        if (node === searched) return { ...data, color: "#dc2626", highlighted: true, forceLabel: true, zIndex: 2 };
        if (near.has(node)) return { ...data, forceLabel: true, zIndex: 1 };
        return { ...data, color: "#cbd5e1", label: "" };
      },
      edgeReducer: (edge, data) => {
        // with many arrows the labels would cover each other: the colour carries k, the label shows on focus
        if (!focus) return graph.size > 60 ? { ...data, label: "" } : data;
        const [s, t] = graph.extremities(edge);
        return s === focus || t === focus ? { ...data, size: 2.5 } : { ...data, hidden: true };
      },
    });
  }, [sigma, setSettings, hovered, highlightRule]);
  return null;
}

export interface HierarchyGraphProps {
  model: HierarchyGraphModel;
  highlightRule: number | null;
  onOpenRule(rule: number): void;
}

export function HierarchyGraph({ model, highlightRule, onOpenRule }: HierarchyGraphProps) {
  const graph = useMemo(() => buildGraph(model), [model]);
  const settings = useMemo(
    () => ({
      renderEdgeLabels: true,
      defaultEdgeType: "arrow",
      labelFont: '"Inter Variable", sans-serif',
      labelSize: 13,
      labelWeight: "600",
      edgeLabelFont: '"Inter Variable", sans-serif',
      edgeLabelSize: 11,
      edgeLabelColor: { attribute: "color" },
      labelRenderedSizeThreshold: 0,
      labelDensity: 1,
      labelGridCellSize: 60,
      zIndex: true,
      stagePadding: 40,
      // the container can be momentarily zero-wide while the page lays out; sigma redraws on resize
      allowInvalidContainer: true,
    }),
    [],
  );
  return (
    <div
      data-testid="hierarchy-graph"
      data-nodes={model.nodes.length}
      data-edges={model.edges.length}
      className="h-[600px] w-full overflow-hidden rounded-lg border border-slate-200 bg-white"
    >
      <SigmaContainer<NodeAttrs, EdgeAttrs> style={{ height: "100%", width: "100%" }} settings={settings}>
        <LoadGraph graph={graph} />
        <Interactions highlightRule={highlightRule} onOpenRule={onOpenRule} />
      </SigmaContainer>
    </div>
  );
}
