// The project's model hierarchy: an arrow from each model to the models it emulates or coarse-grains onto (approved
// reductions only), composed arrows dashed in a lighter colour and labelled with their time scale.
import { useMemo } from "react";
import { useNavigate } from "react-router-dom";
import type { HierarchyGraph } from "@shared/schemas/reductions";
import { NetworkGraph } from "@/components/graph/network-graph";

const notionColour = {
  "block-emulation": "#0f766e",
  "dynamical-embedding": "#2563eb",
  "coarse-graining": "#c026d3",
} as const;

export function ModelHierarchyGraph({ projectId, graph }: { projectId: string; graph: HierarchyGraph }) {
  const navigate = useNavigate();
  const nodes = useMemo(
    () =>
      graph.nodes.map((n) => ({
        id: n.modelId,
        label: `${n.name} (${n.nodeCount})`,
        color: "#334155",
        size: 6 + Math.min(10, Math.sqrt(n.nodeCount) * 2),
      })),
    [graph],
  );
  const edges = useMemo(
    () =>
      graph.edges.map((e) => ({
        source: e.source,
        target: e.target,
        color: e.isComposed ? "#94a3b8" : notionColour[e.notion],
        label: `${e.isComposed ? "composed, " : ""}t=${e.timeScale}`,
        size: e.isComposed ? 1.5 : 2.5,
      })),
    [graph],
  );
  return (
    <div className="space-y-2" data-testid="model-hierarchy" data-edges={graph.edges.length}>
      <ul className="flex flex-wrap gap-4 text-xs text-slate-600">
        {Object.entries(notionColour).map(([notion, colour]) => (
          <li key={notion} className="flex items-center gap-1">
            <span className="inline-block h-0.5 w-5" style={{ background: colour }} />
            {notion}
          </li>
        ))}
        <li className="flex items-center gap-1">
          <span className="inline-block h-0.5 w-5 bg-slate-400" />
          composed (verified)
        </li>
      </ul>
      <NetworkGraph
        nodes={nodes}
        edges={edges}
        height={460}
        onNodeClick={(id) => navigate(`/projects/${projectId}/models/${id}`)}
        testId="model-hierarchy-graph"
      />
      {graph.edges.length === 0 && (
        <p className="text-sm text-slate-500">
          No approved reductions between this project's models yet. Approved reductions whose target is a stored model
          appear here.
        </p>
      )}
    </div>
  );
}
