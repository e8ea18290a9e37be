// The project's reductions, newest first, with the filters a reviewer uses (state, notion).
import { Link } from "react-router-dom";
import type { ReductionSummary } from "@shared/schemas/reductions";
import { ReviewStateBadge } from "./review-panel";
import { plural } from "@/lib/plural";

const notionLabel = {
  "block-emulation": "block emulation",
  "dynamical-embedding": "dynamical embedding",
  "coarse-graining": "coarse-graining",
  "node-elimination": "node elimination",
  "constant-percolation": "percolation of constants",
} as const;

export interface TableSelection {
  selected: ReadonlySet<string>;
  toggle: (id: string) => void;
  setAll: (ids: string[]) => void;
}

export function ReductionsTable({
  projectId,
  reductions,
  selection,
}: {
  projectId: string;
  reductions: ReductionSummary[];
  /** With a selection, each row gets a check box for the review queue's bulk actions. */
  selection?: TableSelection;
}) {
  const allSelected = selection
    ? reductions.length > 0 && reductions.every((r) => selection.selected.has(r.id))
    : false;
  if (reductions.length === 0)
    return (
      <p
        className="rounded-md border border-dashed border-slate-300 p-6 text-center text-sm text-slate-500"
        data-testid="no-reductions"
      >
        No reductions match. Change the filters, or start a search above.
      </p>
    );
  return (
    <div className="overflow-x-auto rounded-lg border border-slate-200 bg-white">
      <table className="min-w-full text-sm" data-testid="reductions-table">
        <thead className="bg-slate-50 text-left text-xs uppercase text-slate-500">
          <tr>
            {selection && (
              <th className="px-3 py-2">
                <input
                  type="checkbox"
                  aria-label="Select all shown"
                  checked={allSelected}
                  onChange={() => selection.setAll(allSelected ? [] : reductions.map((r) => r.id))}
                  data-testid="select-all"
                />
              </th>
            )}
            <th className="px-3 py-2">Source</th>
            <th className="px-3 py-2">Notion</th>
            <th className="px-3 py-2">t</th>
            <th className="px-3 py-2">Target</th>
            <th className="px-3 py-2">Flags</th>
            <th className="px-3 py-2">Review</th>
            <th className="px-3 py-2">Found</th>
          </tr>
        </thead>
        <tbody>
          {reductions.map((r) => (
            <tr key={r.id} className="border-t border-slate-100 hover:bg-slate-50" data-testid="reduction-row">
              {selection && (
                <td className="px-3 py-2">
                  <input
                    type="checkbox"
                    aria-label={`Select the reduction of ${r.source.modelName} onto ${r.target?.modelName ?? r.targetNames.join(", ")}`}
                    checked={selection.selected.has(r.id)}
                    onChange={() => selection.toggle(r.id)}
                    data-testid="select-reduction"
                  />
                </td>
              )}
              <td className="px-3 py-2">
                <Link
                  to={`/projects/${projectId}/reductions/${r.id}`}
                  className="font-medium text-brand-700 hover:underline"
                >
                  {r.source.modelName}
                </Link>{" "}
                <span className="text-xs text-slate-500">r{r.source.revision}</span>
              </td>
              <td className="px-3 py-2">{notionLabel[r.notion]}</td>
              <td className="px-3 py-2">{r.timeScale}</td>
              <td className="px-3 py-2">
                {r.target ? (
                  r.target.modelName
                ) : (
                  <span className="text-slate-600">
                    {plural(r.targetNodeCount, "node")}: {r.targetNames.join(", ")}
                  </span>
                )}
              </td>
              <td className="px-3 py-2 text-xs text-slate-600">{r.flags.join(", ")}</td>
              <td className="px-3 py-2">
                <ReviewStateBadge state={r.reviewState} />
              </td>
              <td className="px-3 py-2 text-xs text-slate-500">
                {r.foundBy?.displayName ?? "—"} · {new Date(r.createdAt).toLocaleDateString()}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
