// The hierarchy drawn with sigma: nodes are rules or symmetry classes (merged when they emulate each other), arrows
// go from emulator to emulated and carry the least block size. Layers come from the longest emulation chain;
// ForceAtlas2 spreads each layer sideways so related nodes sit near each other.
import "@react-sigma/core/lib/style.css";
import { SigmaContainer, useLoadGraph, useRegisterEvents, useSetSettings, useSigma } from "@react-sigma/core";
import Graph from "graphology";
import forceAtlas2 from "graphology-layout-forceatlas2";
import { useEffect, useMemo, useState } from "react";
import type { HierarchyGraphModel } from "../lib/hierarchy-graph-model";

interface NodeAttrs { x: number; y: number; size: number; label: string; color: string; rules: number[] }
interface EdgeAttrs { size: number; label: string; color: string; type: string }

const blockColours = ["#0f766e", "#0d9488", "#2563eb", "#7c3aed", "#c026d3", "#db2777", "#ea580c", "#ca8a04"];

export function edgeColour(minBlock: number): string {
  return blockColours[Math.min(blockColours.length - 1, Math.max(0, minBlock - 1))]!;
}

function buildGraph(model: HierarchyGraphModel): Graph<NodeAttrs, EdgeAttrs> {
  const graph = new Graph<NodeAttrs, EdgeAttrs>({ type: "directed", multi: false });
  const perLayer = new Map<number, number>();
  const layerSize = new Map<number, number>();
  for (const n of model.nodes) layerSize.set(n.layer, (layerSize.get(n.layer) ?? 0) + 1);
  const widest = Math.max(1, ...layerSize.values());
  for (const n of model.nodes) {
    const i = perLayer.get(n.layer) ?? 0;
    perLayer.set(n.layer, i + 1);
    const count = layerSize.get(n.layer)!;
    graph.addNode(n.id, {
      x: ((i + 0.5) / count - 0.5) * widest,
      y: -n.layer * 3,
      size: Math.min(14, 5 + 2 * Math.sqrt(n.rules.length)),
      label: n.label,
      color: "#334155",
      rules: n.rules,
    });
  }
  for (const e of model.edges) {
    graph.addDirectedEdge(e.source, e.target, { size: 1.6, label: `k=${e.minBlock}`, color: edgeColour(e.minBlock), type: "arrow" });
  }
  if (graph.order > 1) {
    const layers = new Map(model.nodes.map((n) => [n.id, n.layer]));
    forceAtlas2.assign(graph, { iterations: 200, settings: { ...forceAtlas2.inferSettings(graph), gravity: 0.5, scalingRatio: 8 } });
    // keep the sideways placement ForceAtlas2 found, but put every node back on its layer so emulators stay above
    const xs = graph.mapNodes((_, a) => a.x);
    const span = Math.max(1e-9, Math.max(...xs) - Math.min(...xs));
    const rowGap = Math.max(span / Math.max(1, (Math.max(...layers.values()) + 1) * 1.2), 1);
    graph.forEachNode((id) => graph.setNodeAttribute(id, "y", -layers.get(id)! * rowGap));
    spreadLayers(graph, span / (widest + 1));
  }
  return graph;
}

/** Nodes on one layer that ForceAtlas2 put on top of each other are pushed apart to a minimum gap. */
function spreadLayers(graph: Graph<NodeAttrs, EdgeAttrs>, gap: number) {
  const byRow = new Map<number, string[]>();
  graph.forEachNode((id, a) => {
    const row = byRow.get(a.y) ?? [];
    row.push(id);
    byRow.set(a.y, row);
  });
  for (const ids of byRow.values()) {
    ids.sort((p, q) => graph.getNodeAttribute(p, "x") - graph.getNodeAttribute(q, "x"));
    let last = -Infinity;
    for (const id of ids) {
      const x = Math.max(graph.getNodeAttribute(id, "x"), last + gap);
      graph.setNodeAttribute(id, "x", x);
      last = x;
    }
  }
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
    const searched = highlightRule === null ? null : graph.findNode((_, a) => a.rules.includes(highlightRule)) ?? null;
    const focus = hovered ?? searched;
    const near = new Set<string>();
    if (focus && graph.hasNode(focus)) {
      near.add(focus);
      graph.forEachNeighbor(focus, (n) => near.add(n));
    }
    setSettings({
      nodeReducer: (node, data) => {
        if (!focus) return data;
        if (node === searched) return { ...data, color: "#dc2626", highlighted: true, zIndex: 2 };
        if (near.has(node)) return { ...data, zIndex: 1 };
        return { ...data, color: "#cbd5e1", label: "" };
      },
      edgeReducer: (edge, data) => {
        if (!focus) return data;
        const [s, t] = graph.extremities(edge);
        return s === focus || t === focus ? { ...data, size: 2.5 } : { ...data, hidden: true };
      },
    });
    if (searched && !hovered) {
      const pos = sigma.getNodeDisplayData(searched);
      if (pos) sigma.getCamera().animate({ x: pos.x, y: pos.y, ratio: 0.6 }, { duration: 300 });
    }
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
      zIndex: true,
      stagePadding: 40,
    }),
    [],
  );
  return (
    <div data-testid="hierarchy-graph" data-nodes={model.nodes.length} data-edges={model.edges.length} className="h-[640px] w-full overflow-hidden rounded-lg border border-slate-200 bg-white">
      <SigmaContainer<NodeAttrs, EdgeAttrs> style={{ height: "100%", width: "100%" }} settings={settings}>
        <LoadGraph graph={graph} />
        <Interactions highlightRule={highlightRule} onOpenRule={onOpenRule} />
      </SigmaContainer>
    </div>
  );
}
