// The wiring diagram: sigma (WebGL) with edges coloured and headed by sign (arrow activates, flat bar represses),
// self-regulation drawn as loops and opposite regulations bent apart; node search, hover or keyboard focus shows a
// node's regulators and targets, a click (or Enter in the node list) pins them; an optional state painted on the
// nodes (e.g. the attractor selected in the table); PNG and SVG of the same picture.
import { useCallback, useMemo, useState } from "react";
import type { StructureResult } from "@shared/schemas/models";
import { ExportButtons } from "@/components/graph/export-buttons";
import { GraphEdgeList } from "@/components/graph/graph-edge-list";
import { GraphNodeList } from "@/components/graph/graph-node-list";
import { SIGN_COLOURS, STATE_COLOURS } from "@/components/graph/palette";
import { signStyle } from "@/components/graph/sign-style";
import { drawScene } from "@/components/graph/scene-drawing";
import { SceneSigma } from "@/components/graph/scene-sigma";
import { drawingToSvg } from "@/components/graph/scene-svg";
import { wiringScene } from "../lib/wiring-graph";

export interface WiringDiagramProps {
  structure: StructureResult;
  /** A state as '0'/'1' text in node order to paint on the nodes, or null. */
  state: string | null;
  /** Download name without extension. */
  fileName: string;
}

function findNode(structure: StructureResult, search: string): string | null {
  const query = search.trim().toLowerCase();
  if (!query) return null;
  const names = structure.nodes.map((n) => n.name);
  return names.find((n) => n.toLowerCase() === query) ?? names.find((n) => n.toLowerCase().includes(query)) ?? null;
}

export function WiringDiagram({ structure, state, fileName }: WiringDiagramProps) {
  const [search, setSearch] = useState("");
  const [hovered, setHovered] = useState<string | null>(null);
  const [pinned, setPinned] = useState<string | null>(null);
  const scene = useMemo(() => wiringScene(structure), [structure]);
  const found = findNode(structure, search);
  const focus = hovered ?? pinned;
  const order = useMemo(() => new Map(structure.nodes.map((n, i) => [n.name, i] as const)), [structure]);
  const colourOf = useCallback(
    (id: string, colour: string) =>
      state ? (state[order.get(id)!] === "1" ? STATE_COLOURS.on : STATE_COLOURS.off) : colour,
    [state, order],
  );
  const toggle = useCallback((id: string) => setPinned((p) => (p === id ? null : id)), []);
  const shown = focus ?? found;
  const node = shown ? structure.nodes.find((n) => n.name === shown) : null;
  const regulators = node ? structure.edges.filter((e) => e.target === node.name) : [];
  const targets = node ? structure.edges.filter((e) => e.source === node.name) : [];
  const loops = structure.edges.filter((e) => e.source === e.target).length;

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-3">
        <input
          type="search"
          data-testid="node-search"
          aria-label="Find a node"
          placeholder="Find a node…"
          value={search}
          onChange={(e) => setSearch(e.target.value)}
          className="w-48 rounded-md border border-slate-300 px-2 py-1 text-sm"
        />
        <ul className="flex flex-wrap gap-3 text-xs text-slate-600" aria-label="Legend">
          {(["positive", "negative", "dual"] as const).map((s) => (
            <li key={s} className="flex items-center gap-1">
              <span className="inline-block h-0.5 w-5" style={{ background: SIGN_COLOURS[s] }} />
              {signStyle[s].head === "bar" ? "⊣" : "→"} {signStyle[s].label}
            </li>
          ))}
          {state && (
            <li className="flex items-center gap-1">
              <span className="inline-block h-3 w-3 rounded-full" style={{ background: STATE_COLOURS.on }} /> on
              <span className="ml-1 inline-block h-3 w-3 rounded-full" style={{ background: STATE_COLOURS.off }} /> off
            </li>
          )}
        </ul>
        <div className="ml-auto">
          <ExportButtons
            fileName={fileName}
            svg={() =>
              drawingToSvg(
                drawScene(scene, { colourOf: state ? colourOf : undefined }),
                `Wiring diagram of ${fileName}`,
              )
            }
          />
        </div>
      </div>
      <div className="relative">
        <SceneSigma
          scene={scene}
          height={460}
          focus={focus}
          emphasis={found}
          colourOf={state ? colourOf : undefined}
          showEdgeLabels={false}
          onHoverNode={setHovered}
          onClickNode={toggle}
          testId="wiring-diagram"
          description={`Wiring diagram: ${structure.nodes.length} nodes and ${structure.edges.length} regulations${loops ? `, ${loops} of them self-regulation` : ""}. The node list and the edges as text below give the same content.`}
        />
        {node && (
          <div
            data-testid="node-details"
            className="pointer-events-none absolute bottom-2 left-2 z-10 max-w-sm rounded-md border border-slate-200 bg-white/95 p-3 text-xs shadow"
          >
            <p className="text-sm font-semibold text-slate-900">
              {node.name}
              {pinned === node.name && (
                <span className="ml-2 font-normal text-slate-500">(pinned; click again to release)</span>
              )}
            </p>
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
                  <span key={e.source} style={{ color: SIGN_COLOURS[e.sign] }}>
                    {i ? ", " : ""}
                    {e.source === node.name ? "itself" : e.source} ({e.sign})
                  </span>
                ))}
              </p>
            )}
            {targets.length > 0 && (
              <p className="mt-1 text-slate-600">
                regulates: {targets.map((e) => (e.target === node.name ? "itself" : e.target)).join(", ")}
              </p>
            )}
          </div>
        )}
      </div>
      <GraphNodeList
        nodes={structure.nodes.map((n) => ({
          id: n.name,
          label: n.name,
          detail: `${n.inDegree} regulators, regulates ${n.outDegree}`,
        }))}
        label="Nodes of the wiring diagram"
        hint="Nodes: Tab to one to see its regulators in the picture; Enter pins it."
        activeId={pinned}
        onFocusNode={setHovered}
        onActivate={toggle}
        testId="wiring-node-list"
      />
      <GraphEdgeList edges={scene.edges} testId="wiring-edge-list" />
    </div>
  );
}
