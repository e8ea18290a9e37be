// The project's runs, newest first, each linking to its page.
import { Link } from "react-router-dom";
import type { Run } from "@shared/schemas/runs";
import { ProgressBar } from "@/components/ui/progress-bar";
import { runTitle } from "../lib/run-title";
import { RunStateBadge } from "./run-state-badge";

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" });

export function RunsTable({ projectId, runs }: { projectId: string; runs: Run[] }) {
  if (runs.length === 0)
    return (
      <p className="text-sm text-slate-500" data-testid="runs-empty">
        No runs match.
      </p>
    );
  return (
    <div className="overflow-x-auto rounded-lg border border-slate-200 bg-white">
      <table className="min-w-full divide-y divide-slate-200 text-sm" data-testid="runs-table">
        <thead className="bg-slate-50 text-left text-xs font-semibold uppercase tracking-wide text-slate-600">
          <tr>
            <th className="px-4 py-2">Run</th>
            <th className="px-4 py-2">State</th>
            <th className="w-48 px-4 py-2">Progress</th>
            <th className="px-4 py-2">Started</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-slate-100">
          {runs.map((run) => (
            <tr key={run.id} className="hover:bg-slate-50">
              <td className="px-4 py-2">
                <Link
                  to={`/projects/${projectId}/runs/${run.id}`}
                  className="font-medium text-brand-700 hover:underline"
                >
                  {runTitle(run)}
                </Link>
                <span className="ml-2 font-mono text-xs text-slate-500">{run.kind}</span>
              </td>
              <td className="px-4 py-2">
                <RunStateBadge state={run.state} queuePosition={run.queuePosition} />
              </td>
              <td className="px-4 py-2">
                <ProgressBar
                  fraction={run.progressFraction}
                  label={`Progress of run ${run.id}`}
                  tone={run.state === "failed" ? "danger" : run.state === "cancelled" ? "muted" : "brand"}
                />
              </td>
              <td className="whitespace-nowrap px-4 py-2 text-slate-600">{when(run.createdAt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
