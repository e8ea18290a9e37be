// The progress of one run wherever a run is shown (its page, a model's background analysis, the automaton
// hierarchy): the bar, the phase, and elapsed / remaining time ticking every second between polls.
import { useEffect, useState } from "react";
import { isRunFinished, type Run } from "@shared/schemas/runs";
import { ProgressBar } from "@/components/ui/progress-bar";
import { formatDuration, timeEstimate } from "../lib/time-estimate";

function useNow(isLive: boolean): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (!isLive) return;
    const id = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(id);
  }, [isLive]);
  return now;
}

export function RunProgress({ run, label = "Run progress" }: { run: Run; label?: string }) {
  const isLive = !isRunFinished(run.state);
  const now = useNow(isLive);
  const { elapsedMs, remainingMs } = timeEstimate(run, now);
  const tone = run.state === "failed" ? "danger" : run.state === "cancelled" ? "muted" : "brand";
  return (
    <div className="space-y-2" data-testid="run-progress" data-state={run.state} data-fraction={run.progressFraction}>
      <div className="flex flex-wrap items-baseline justify-between gap-2 text-sm">
        <span className="font-medium text-slate-800">
          {Math.round(run.progressFraction * 100)}%{" "}
          <span className="font-normal text-slate-500">· {run.progressPhase}</span>
        </span>
        <span className="text-slate-600" data-testid="run-times">
          {run.startedAt ? (
            <>Elapsed {formatDuration(elapsedMs)}</>
          ) : run.queuePosition ? (
            `Waiting for a worker · place ${run.queuePosition} in the queue`
          ) : (
            "Waiting for a worker"
          )}
          {isLive &&
            run.startedAt &&
            (remainingMs === null ? " · estimating time left…" : ` · about ${formatDuration(remainingMs)} left`)}
        </span>
      </div>
      <ProgressBar fraction={run.progressFraction} label={label} tone={tone} />
      <p className="text-xs text-slate-500">
        {run.shardsDone} of {run.shardCount} shard{run.shardCount === 1 ? "" : "s"} done
      </p>
    </div>
  );
}
