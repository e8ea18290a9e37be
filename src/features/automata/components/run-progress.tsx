// The state of a background hierarchy run: a progress bar while it goes, the outcome when it stops.
import type { Run } from "@shared/schemas/runs";

export function RunProgress({ run }: { run: Run }) {
  const percent = Math.round(run.progressFraction * 100);
  return (
    <div className="space-y-1" data-testid="hierarchy-run-progress" data-state={run.state}>
      <div className="flex justify-between text-xs text-slate-600">
        <span>{run.state === "running" || run.state === "queued" ? `${run.state} · ${run.progressPhase || "starting"}` : run.state}</span>
        <span>{percent}% · {run.shardsDone}/{run.shardCount} shards</span>
      </div>
      <div className="h-2 w-full overflow-hidden rounded bg-slate-200" role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={percent}>
        <div className={`h-full ${run.state === "failed" ? "bg-red-600" : "bg-brand-600"}`} style={{ width: `${percent}%` }} />
      </div>
      {run.error && <p className="text-sm text-red-700">{run.error.message}</p>}
    </div>
  );
}
