// The hierarchy drawn with sigma: nodes are rules or symmetry classes (merged when they emulate each other), arrows
// go from emulator to emulated, coloured by the least block size. Every node is labelled; hovering a node, or
// tabbing to it in the list below, rings it and shows only its arrows with their block sizes; a click or Enter
// opens the rule.
import { useCallback, useMemo, useState } from "react";
import { ExportButtons } from "@/components/graph/export-buttons";
import { GraphEdgeList } from "@/components/graph/graph-edge-list";
import { GraphNodeList } from "@/components/graph/graph-node-list";
import { drawScene } from "@/components/graph/scene-drawing";
import { SceneSigma } from "@/components/graph/scene-sigma";
import { drawingToSvg } from "@/components/graph/scene-svg";
import type { HierarchyGraphModel } from "../lib/hierarchy-graph-model";
import { hierarchyScene, nodeName } from "../lib/hierarchy-scene";

export interface HierarchyGraphProps {
  model: HierarchyGraphModel;
  highlightRule: number | null;
  onOpenRule(rule: number): void;
  /** Download name without extension. */
  fileName: string;
}

/** With more arrows than this, block-size labels show only on the focused node's arrows (colour carries k). */
const MAX_LABELLED_EDGES = 60;

export function HierarchyGraph({ model, highlightRule, onOpenRule, fileName }: HierarchyGraphProps) {
  const scene = useMemo(() => hierarchyScene(model), [model]);
  const [focus, setFocus] = useState<string | null>(null);
  const searched = useMemo(
    () => (highlightRule === null ? null : (model.nodes.find((n) => n.rules.includes(highlightRule))?.id ?? null)),
    [model, highlightRule],
  );
  const open = useCallback(
    (id: string) => {
      const rule = model.nodes.find((n) => n.id === id)?.rules[0];
      if (rule !== undefined) onOpenRule(rule);
    },
    [model, onOpenRule],
  );
  const layers = useMemo(() => {
    const byLayer = new Map<number, HierarchyGraphModel["nodes"]>();
    for (const n of model.nodes) byLayer.set(n.layer, [...(byLayer.get(n.layer) ?? []), n]);
    return [...byLayer.entries()].sort((a, b) => a[0] - b[0]);
  }, [model]);

  return (
    <div className="space-y-2">
      <div className="flex justify-end">
        <ExportButtons
          fileName={fileName}
          svg={() =>
            drawingToSvg(
              drawScene(scene, { labelsBelow: true, fit: { width: 1100, height: 640 }, fontSize: 12 }),
              "Block emulation between elementary cellular automata",
            )
          }
          testIdPrefix="hierarchy-download"
        />
      </div>
      <SceneSigma
        scene={scene}
        height={600}
        focus={focus ?? searched}
        emphasis={searched}
        showEdgeLabels={scene.edges.length <= MAX_LABELLED_EDGES}
        labelsBelow
        onHoverNode={setFocus}
        onClickNode={open}
        testId="hierarchy-graph"
        description={`Block-emulation hierarchy: ${model.nodes.length} nodes in ${layers.length} layers, ${model.edges.length} arrows from emulator to emulated; every node is in the list below and every arrow in the text list.`}
      />
      <div className="space-y-1" data-testid="hierarchy-node-lists">
        {layers.map(([layer, nodes]) => (
          <GraphNodeList
            key={layer}
            nodes={nodes.map((n) => ({ id: n.id, label: n.label, detail: nodeName(n.rules, n.label) }))}
            label={`Layer ${layer + 1} of the hierarchy`}
            hint={
              layer === layers[0]![0]
                ? `Layer ${layer + 1} (top). Tab to a node to see its arrows; Enter opens the rule.`
                : `Layer ${layer + 1}`
            }
            activeId={focus}
            onFocusNode={setFocus}
            onActivate={open}
            testId={`hierarchy-layer-${layer}`}
          />
        ))}
      </div>
      <GraphEdgeList edges={scene.edges} testId="hierarchy-edge-list" />
    </div>
  );
}
