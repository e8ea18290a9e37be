// The project's model hierarchy: an arrow from each model down to the models it emulates, embeds or coarse-grains
// onto (approved reductions only), composed arrows thinner and grey. Laid out in layers by dagre and drawn as
// inline SVG: every model is a link (Tab, Enter), the size of a dot says how many nodes the model has, and the
// same drawing downloads as SVG and PNG.
import { useMemo } from "react";
import { Link, useNavigate } from "react-router-dom";
import type { HierarchyGraph } from "@shared/schemas/reductions";
import { ExportButtons } from "@/components/graph/export-buttons";
import { GraphEdgeList } from "@/components/graph/graph-edge-list";
import { drawScene } from "@/components/graph/scene-drawing";
import { drawingToSvg } from "@/components/graph/scene-svg";
import { SceneSvgView } from "@/components/graph/scene-svg-view";
import { NODE_COLOUR } from "@/components/graph/palette";
import { COMPOSED_COLOUR, layoutHierarchy, modelRadius, NOTION_COLOURS, NOTION_VERBS } from "../lib/hierarchy-layout";

function SizeLegend({ counts }: { counts: number[] }) {
  const sorted = [...new Set(counts)].sort((a, b) => a - b);
  const shown =
    sorted.length <= 3 ? sorted : [sorted[0]!, sorted[Math.floor(sorted.length / 2)]!, sorted[sorted.length - 1]!];
  const largest = modelRadius(shown[shown.length - 1] ?? 1);
  return (
    <div className="flex items-center gap-3 text-xs text-slate-600" data-testid="size-legend">
      <span>Dot size = nodes in the model:</span>
      {shown.map((count) => (
        <span key={count} className="flex items-center gap-1">
          <svg width={2 * largest + 2} height={2 * largest + 2} aria-hidden="true">
            <circle cx={largest + 1} cy={largest + 1} r={modelRadius(count)} fill={NODE_COLOUR} />
          </svg>
          {count}
        </span>
      ))}
    </div>
  );
}

export function ModelHierarchyGraph({ projectId, graph }: { projectId: string; graph: HierarchyGraph }) {
  const navigate = useNavigate();
  const { scene, isolated } = useMemo(() => layoutHierarchy(graph), [graph]);
  const drawing = useMemo(() => drawScene(scene, { scale: 1, labelRoom: Infinity }), [scene]);
  const hrefOf = (id: string) => `/projects/${projectId}/models/${id}`;

  return (
    <div className="space-y-3" data-testid="model-hierarchy" data-edges={graph.edges.length}>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <ul className="flex flex-wrap gap-4 text-xs text-slate-600" aria-label="Arrow colours">
          {Object.entries(NOTION_COLOURS).map(([notion, colour]) => (
            <li key={notion} className="flex items-center gap-1">
              <span className="inline-block h-1 w-5 rounded" style={{ background: colour }} />
              {NOTION_VERBS[notion as keyof typeof NOTION_VERBS]}
            </li>
          ))}
          <li className="flex items-center gap-1">
            <span className="inline-block h-0.5 w-5" style={{ background: COMPOSED_COLOUR }} />
            composed (verified)
          </li>
        </ul>
        <SizeLegend counts={graph.nodes.map((n) => n.nodeCount)} />
      </div>
      {scene.nodes.length > 0 ? (
        <>
          <div className="overflow-x-auto rounded-lg border border-slate-200 bg-white p-2">
            <SceneSvgView
              drawing={drawing}
              description={`Model hierarchy: ${scene.nodes.length} models joined by ${scene.edges.length} reductions, bigger models above; the reductions are listed as text below.`}
              hrefOf={hrefOf}
              onActivate={(id) => navigate(hrefOf(id))}
              testId="model-hierarchy-graph"
            />
          </div>
          <div className="flex flex-wrap items-start justify-between gap-2">
            <GraphEdgeList edges={scene.edges} testId="model-hierarchy-edges" />
            <ExportButtons
              svg={() => drawingToSvg(drawing, "Model hierarchy")}
              fileName="model-hierarchy"
              testIdPrefix="hierarchy-download"
            />
          </div>
        </>
      ) : (
        <p className="text-sm text-slate-500">
          No approved reductions between this project's models yet. Approved reductions whose target is a stored model
          appear here.
        </p>
      )}
      {isolated.length > 0 && (
        <div className="text-sm text-slate-600">
          <p>Not joined to another model by an approved reduction:</p>
          <ul className="mt-1 flex flex-wrap gap-2" data-testid="isolated-models">
            {isolated.map((n) => (
              <li key={n.id}>
                <Link
                  to={hrefOf(n.id)}
                  className="rounded-md border border-slate-300 bg-white px-2 py-0.5 text-xs text-slate-700 hover:bg-slate-50 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-amber-600"
                >
                  {n.label}
                </Link>
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
