// A graph's edges in words, the text alternative beside the picture: one item per edge drawn, self-loops included.
import type { SceneEdge } from "./graph-scene";

export function GraphEdgeList({ edges, testId }: { edges: Pick<SceneEdge, "id" | "description">[]; testId?: string }) {
  return (
    <details className="text-sm text-slate-700">
      <summary className="cursor-pointer rounded text-xs font-medium text-slate-600 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-amber-600">
        The {edges.length} {edges.length === 1 ? "edge" : "edges"} as text
      </summary>
      <ul data-testid={testId} data-count={edges.length} className="mt-1 list-disc space-y-0.5 pl-5 text-xs">
        {edges.map((e) => (
          <li key={e.id}>{e.description}</li>
        ))}
      </ul>
    </details>
  );
}
