// The wiring diagram: sigma (WebGL) through @react-sigma/core, ForceAtlas2 layout, edges coloured and shaped by
// sign (green arrow activates, red flat head represses, purple dual), node search, hover details, PNG export, and
// an optional state painted on the nodes (e.g. the attractor selected in the table).
import "@react-sigma/core/lib/style.css";
import { SigmaContainer, useLoadGraph, useRegisterEvents, useSetSettings, useSigma } from "@react-sigma/core";
import { createEdgeArrowProgram } from "sigma/rendering";
import type { Settings } from "sigma/settings";
import { useEffect, useMemo, useState } from "react";
import type { StructureResult } from "@shared/schemas/models";
import {
  buildWiringGraph,
  NODE_COLOUR,
  signStyle,
  type WiringEdgeAttrs,
  type WiringNodeAttrs,
} from "../lib/wiring-graph";
import { drawWiringPng } from "../lib/wiring-png";

const ON = "#0d9488";
const OFF = "#cbd5e1";

function LoadGraph({ structure }: { structure: StructureResult }) {
  const loadGraph = useLoadGraph<WiringNodeAttrs, WiringEdgeAttrs>();
  const graph = useMemo(() => buildWiringGraph(structure), [structure]);
  useEffect(() => loadGraph(graph), [loadGraph, graph]);
  return null;
}

interface InteractionsProps {
  search: string;
  state: string | null;
  onHover(node: string | null): void;
  pngName: string;
}

function Interactions({ search, state, onHover, pngName }: InteractionsProps) {
  const sigma = useSigma<WiringNodeAttrs, WiringEdgeAttrs>();
  const registerEvents = useRegisterEvents<WiringNodeAttrs, WiringEdgeAttrs>();
  const setSettings = useSetSettings<WiringNodeAttrs, WiringEdgeAttrs>();
  const [hovered, setHovered] = useState<string | null>(null);

  useEffect(() => {
    registerEvents({
      enterNode: (e) => {
        setHovered(e.node);
        onHover(e.node);
      },
      leaveNode: () => {
        setHovered(null);
        onHover(null);
      },
    });
  }, [registerEvents, onHover]);

  useEffect(() => {
    const graph = sigma.getGraph();
    const query = search.trim().toLowerCase();
    const found = query
      ? (graph.findNode((id) => id.toLowerCase() === query) ??
        graph.findNode((id) => id.toLowerCase().includes(query)) ??
        null)
      : null;
    const focus = hovered ?? found;
    const near = new Set<string>();
    if (focus && graph.hasNode(focus)) {
      near.add(focus);
      graph.forEachNeighbor(focus, (n) => near.add(n));
    }
    const order = graph.nodes();
    setSettings({
      nodeReducer: (node, data) => {
        let color = data.color;
        if (state) color = state[order.indexOf(node)] === "1" ? ON : OFF;
        if (focus && !near.has(node)) return { ...data, color: "#e2e8f0", label: data.label };
        if (node === found) return { ...data, color: "#f59e0b", highlighted: true, zIndex: 2 };
        return { ...data, color, zIndex: near.has(node) ? 1 : 0 };
      },
      edgeReducer: (edge, data) => {
        if (!focus) return data;
        const [s, t] = graph.extremities(edge);
        return s === focus || t === focus ? { ...data, size: 3 } : { ...data, hidden: true };
      },
    });
  }, [sigma, setSettings, hovered, search, state]);

  // Centre on a found node once per search result (not on every re-render).
  const query = search.trim().toLowerCase();
  useEffect(() => {
    if (!query) return;
    const graph = sigma.getGraph();
    const found =
      graph.findNode((id) => id.toLowerCase() === query) ?? graph.findNode((id) => id.toLowerCase().includes(query));
    if (!found) return;
    // Display data are only normalised once sigma has rendered with the new reducers, so centre after that render.
    const centre = () => {
      const pos = sigma.getNodeDisplayData(found);
      if (pos) sigma.getCamera().animate({ x: pos.x, y: pos.y, ratio: 0.8 }, { duration: 250 });
    };
    sigma.once("afterRender", centre);
    sigma.scheduleRefresh();
    return () => {
      sigma.off("afterRender", centre);
      sigma.getCamera().setState({ x: 0.5, y: 0.5, ratio: 1 });
    };
  }, [sigma, query]);

  return (
    <button
      type="button"
      data-testid="download-png"
      onClick={() => {
        const url = drawWiringPng(sigma, state);
        const a = document.createElement("a");
        a.href = url;
        a.download = pngName;
        a.click();
      }}
      className="absolute right-2 top-2 z-10 rounded-md border border-slate-300 bg-white/90 px-2 py-1 text-xs font-medium text-slate-700 hover:bg-white"
    >
      PNG
    </button>
  );
}

export interface WiringDiagramProps {
  structure: StructureResult;
  /** A state as '0'/'1' text in node order to paint on the nodes, or null. */
  state: string | null;
  pngName: string;
}

export function WiringDiagram({ structure, state, pngName }: WiringDiagramProps) {
  const [search, setSearch] = useState("");
  const [hovered, setHovered] = useState<string | null>(null);
  const settings = useMemo(
    (): Partial<Settings<WiringNodeAttrs, WiringEdgeAttrs>> => ({
      defaultEdgeType: "activation",
      edgeProgramClasses: {
        activation: createEdgeArrowProgram<WiringNodeAttrs, WiringEdgeAttrs>(),
        // A short, wide head reads as the flat bar of a repression.
        inhibition: createEdgeArrowProgram<WiringNodeAttrs, WiringEdgeAttrs>({
          lengthToThicknessRatio: 1.5,
          widenessToThicknessRatio: 8,
        }),
      },
      labelFont: '"Inter Variable", sans-serif',
      labelSize: 13,
      labelWeight: "600",
      labelRenderedSizeThreshold: 0,
      // Regulatory networks are small enough that every name should show.
      labelDensity: 10,
      labelGridCellSize: 40,
      zIndex: true,
      stagePadding: 40,
      // The container is briefly detached when the revision changes; sigma must not throw then.
      allowInvalidContainer: true,
    }),
    [],
  );
  const node = hovered ? structure.nodes.find((n) => n.name === hovered) : null;
  const regulators = hovered ? structure.edges.filter((e) => e.target === hovered) : [];
  const targets = hovered ? structure.edges.filter((e) => e.source === hovered) : [];

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-3">
        <input
          type="search"
          data-testid="node-search"
          placeholder="Find a node…"
          value={search}
          onChange={(e) => setSearch(e.target.value)}
          className="w-48 rounded-md border border-slate-300 px-2 py-1 text-sm"
        />
        <ul className="flex flex-wrap gap-3 text-xs text-slate-600">
          {(["positive", "negative", "dual"] as const).map((s) => (
            <li key={s} className="flex items-center gap-1">
              <span className="inline-block h-0.5 w-5" style={{ background: signStyle[s].color }} />
              {signStyle[s].label}
            </li>
          ))}
          {state && (
            <li className="flex items-center gap-1">
              <span className="inline-block h-3 w-3 rounded-full" style={{ background: ON }} /> on
              <span className="ml-1 inline-block h-3 w-3 rounded-full" style={{ background: OFF }} /> off
            </li>
          )}
        </ul>
      </div>
      <div className="relative">
        <div
          data-testid="wiring-diagram"
          data-nodes={structure.nodes.length}
          data-edges={structure.edges.filter((e) => e.source !== e.target).length}
          className="h-[460px] w-full overflow-hidden rounded-lg border border-slate-200 bg-white"
        >
          <SigmaContainer<WiringNodeAttrs, WiringEdgeAttrs>
            style={{ height: "100%", width: "100%" }}
            settings={settings}
          >
            <LoadGraph structure={structure} />
            <Interactions search={search} state={state} onHover={setHovered} pngName={pngName} />
          </SigmaContainer>
        </div>
        {node && (
          <div
            data-testid="node-details"
            className="pointer-events-none absolute bottom-2 left-2 z-10 max-w-sm rounded-md border border-slate-200 bg-white/95 p-3 text-xs shadow"
          >
            <p className="text-sm font-semibold text-slate-900">{node.name}</p>
            <p className="mt-1 font-mono text-slate-700">
              {node.name}' = {node.rule}
            </p>
            <p className="mt-1 text-slate-600">
              in-degree {node.inDegree}, out-degree {node.outDegree}
              {node.isInput ? " · input (keeps its value)" : ""}
            </p>
            {regulators.length > 0 && (
              <p className="mt-1 text-slate-600">
                regulators:{" "}
                {regulators.map((e, i) => (
                  <span key={e.source} style={{ color: signStyle[e.sign].color }}>
                    {i ? ", " : ""}
                    {e.source} ({e.sign})
                  </span>
                ))}
              </p>
            )}
            {targets.length > 0 && (
              <p className="mt-1 text-slate-600">regulates: {targets.map((e) => e.target).join(", ")}</p>
            )}
          </div>
        )}
      </div>
    </div>
  );
}

export { NODE_COLOUR };
