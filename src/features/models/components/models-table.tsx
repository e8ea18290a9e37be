// The project's models: name, nodes, revision, who changed it last, when.
import { Link } from "react-router-dom";
import type { ModelSummary } from "@shared/schemas/models";

const sourceLabel: Record<ModelSummary["source"], string> = {
  rules: "rule text",
  sbml: "SBML-qual",
  csv: "truth tables",
  generator: "generator",
  edit: "edited",
};

export function ModelsTable({ projectId, models }: { projectId: string; models: readonly ModelSummary[] }) {
  if (models.length === 0) {
    return (
      <p className="rounded-md border border-dashed border-slate-300 bg-white p-6 text-center text-sm text-slate-600">
        No models yet.
      </p>
    );
  }
  return (
    <div className="overflow-x-auto rounded-lg border border-slate-200 bg-white">
      <table data-testid="models-table" className="min-w-full divide-y divide-slate-200 text-sm">
        <thead className="bg-slate-50 text-left text-xs font-semibold uppercase tracking-wide text-slate-600">
          <tr>
            <th className="px-4 py-2">Name</th>
            <th className="px-4 py-2 text-right">Nodes</th>
            <th className="px-4 py-2 text-right">Revision</th>
            <th className="px-4 py-2">Source</th>
            <th className="px-4 py-2">Last change by</th>
            <th className="px-4 py-2">When</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-slate-100">
          {models.map((m) => (
            <tr key={m.id} className="hover:bg-slate-50">
              <td className="px-4 py-2">
                <Link
                  to={`/projects/${projectId}/models/${m.id}`}
                  className="font-medium text-brand-700 hover:underline"
                >
                  {m.name}
                </Link>
                {m.description && <p className="max-w-md truncate text-xs text-slate-500">{m.description}</p>}
              </td>
              <td className="px-4 py-2 text-right tabular-nums">{m.nodeCount}</td>
              <td className="px-4 py-2 text-right tabular-nums">r{m.latestRevision}</td>
              <td className="px-4 py-2 text-slate-600">{sourceLabel[m.source]}</td>
              <td className="px-4 py-2 text-slate-600">{m.updatedBy?.displayName ?? "—"}</td>
              <td className="px-4 py-2 text-slate-600">
                <time dateTime={m.updatedAt}>{new Date(m.updatedAt).toLocaleString()}</time>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
