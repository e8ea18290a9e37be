// The expectation-by-revision matrix: one row per expectation, one column per revision (oldest first); each cell
// says pass, fail or undecided (with the reason) and the method that decided. A cell where an expectation that held
// on an earlier revision fails is marked as a break.
import { useState } from "react";
import type { MatrixCell } from "@shared/schemas/expectations";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { useCheckRevision, useExpectationMatrix } from "../api/expectations";

const LOOK: Record<MatrixCell["status"], { mark: string; tone: string; word: string }> = {
  pass: { mark: "✓", tone: "bg-emerald-100 text-emerald-800", word: "pass" },
  fail: { mark: "✗", tone: "bg-red-100 text-red-800", word: "fail" },
  undecided: { mark: "?", tone: "bg-amber-100 text-amber-800", word: "undecided" },
};

export function ExpectationMatrix({
  projectId,
  modelId,
  revision,
  canRun,
}: {
  projectId: string;
  modelId: string;
  revision: number;
  canRun: boolean;
}) {
  const matrix = useExpectationMatrix(projectId, modelId);
  const check = useCheckRevision(projectId, modelId);
  const [picked, setPicked] = useState<MatrixCell | null>(null);
  if (matrix.isPending) return <p className="text-sm text-slate-500">Loading expectations…</p>;
  if (matrix.error) return <Alert>{matrix.error.message}</Alert>;
  const m = matrix.data;
  if (m.expectations.length === 0)
    return <p className="text-sm text-slate-600">No expectations yet: add one below or import a CSV table.</p>;
  const revisions = [...m.revisions].sort((a, b) => a.revision - b.revision);
  const cellOf = (expectationId: string, r: number) =>
    m.cells.find((c) => c.expectationId === expectationId && c.revision === r);
  const breaks = m.cells.filter((c) => c.broke);
  return (
    <div className="space-y-2" data-testid="expectation-matrix">
      <div className="flex flex-wrap items-center gap-3 text-sm">
        {m.pendingRunIds.length > 0 && (
          <span className="text-slate-600" data-testid="matrix-pending">
            Checking… ({m.pendingRunIds.length} check{m.pendingRunIds.length === 1 ? "" : "s"} going)
          </span>
        )}
        {breaks.length > 0 && (
          <span className="rounded bg-red-600 px-2 py-0.5 text-xs font-medium text-white" data-testid="matrix-breaks">
            {breaks.length} break{breaks.length === 1 ? "" : "s"}: an expectation that held before fails
          </span>
        )}
        {canRun && (
          <Button size="sm" variant="secondary" disabled={check.isPending} onClick={() => check.mutate(revision)}>
            Check revision {revision} now
          </Button>
        )}
      </div>
      {check.error && <Alert>{check.error.message}</Alert>}
      <div className="overflow-x-auto">
        <table className="text-sm">
          <thead>
            <tr className="text-left text-xs text-slate-600">
              <th className="py-1 pr-3 font-medium">Expectation</th>
              {revisions.map((r) => (
                <th
                  key={r.revision}
                  className="px-1 text-center font-medium"
                  title={`by ${r.createdBy ?? "—"}, ${new Date(r.createdAt).toLocaleString()}`}
                >
                  r{r.revision}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {m.expectations.map((e) => (
              <tr key={e.id} className="border-t border-slate-100" data-testid="matrix-row" data-key={e.key}>
                <td className="py-1 pr-3">
                  <span className="font-mono">{e.key}</span>
                  <span className="ml-2 text-xs text-slate-500">{e.source}</span>
                </td>
                {revisions.map((r) => {
                  const c = cellOf(e.id, r.revision);
                  if (!c)
                    return (
                      <td key={r.revision} className="px-1 text-center text-slate-400" title="not checked">
                        ·
                      </td>
                    );
                  const look = LOOK[c.status];
                  return (
                    <td key={r.revision} className="px-1 text-center">
                      <button
                        type="button"
                        data-testid="matrix-cell"
                        data-revision={r.revision}
                        data-status={c.status}
                        data-broke={c.broke}
                        title={`${look.word} (${c.method}): ${c.detail}`}
                        onClick={() => setPicked(c)}
                        className={`h-6 w-8 rounded font-semibold ${look.tone} ${c.broke ? "ring-2 ring-red-600" : ""}`}
                      >
                        {look.mark}
                      </button>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {picked && (
        <p className="rounded-md bg-slate-50 p-2 text-sm text-slate-700" data-testid="matrix-detail">
          <span className="font-mono">{m.expectations.find((e) => e.id === picked.expectationId)?.key}</span> on r
          {picked.revision}: <strong>{LOOK[picked.status].word}</strong>
          {picked.broke && <strong className="text-red-700"> (broken by this revision)</strong>} — {picked.detail}
          {picked.reason && <span className="text-amber-800"> (reason: {picked.reason})</span>}
          <span className="text-slate-500"> · decided by {picked.method}</span>
        </p>
      )}
      <p className="text-xs text-slate-500">
        ✓ pass · ✗ fail · ? undecided (the method could not prove either) · a ringed cell fails where the latest earlier
        checked revision passed. Methods: exact state-space analysis on small models, SAT or minimal trap spaces on
        large ones. A check is a statement about the model, not about the cell.
      </p>
    </div>
  );
}
