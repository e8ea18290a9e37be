// The state of a background hierarchy run: a progress bar while it goes, the outcome when it stops.
import type { Run } from "@shared/schemas/runs";
import { ProgressBar } from "@/components/ui/progress-bar";

export function RunProgress({ run }: { run: Run }) {
  const going = run.state === "running" || run.state === "queued";
  return (
    <div className="space-y-1" data-testid="hierarchy-run-progress" data-state={run.state}>
      <div className="flex justify-between text-xs text-slate-600">
        <span>
          {going && run.progressPhase && run.progressPhase !== run.state
            ? `${run.state} · ${run.progressPhase}`
            : run.state}
        </span>
        <span>
          {Math.round(run.progressFraction * 100)}% · {run.shardsDone}/{run.shardCount} shards
        </span>
      </div>
      <ProgressBar
        fraction={run.progressFraction}
        label="Hierarchy run progress"
        tone={run.state === "failed" ? "danger" : going ? "brand" : "muted"}
      />
      {run.state === "succeeded" && (
        <p className="text-sm text-brand-700">Done: the hierarchy is stored and shown below once reloaded.</p>
      )}
      {run.error && <p className="text-sm text-red-700">{run.error.message}</p>}
    </div>
  );
}
