// For models too large to analyse within a request: start the exact analysis as a run, follow its progress, cancel
// it, and reload the attractors when it has succeeded (the server then stores them with the revision).
import { useQueryClient } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { RunProgress, useCancelRun, useRun, useStartRun } from "@/features/runs";
import { modelKeys } from "../api/keys";
import { plural } from "@/lib/plural";
import { EXACT_SYNCHRONOUS_MAX_NODES } from "../lib/analysis-methods";

export interface AttractorRunPanelProps {
  projectId: string;
  modelId: string;
  revision: number;
  revisionId: string;
  nodeCount: number;
  canStart: boolean;
}

export function AttractorRunPanel({
  projectId,
  modelId,
  revision,
  revisionId,
  nodeCount,
  canStart,
}: AttractorRunPanelProps) {
  const qc = useQueryClient();
  const start = useStartRun();
  const cancel = useCancelRun();
  const [runId, setRunId] = useState<string | null>(null);
  const run = useRun(projectId, runId);
  const state = run.data?.state;

  useEffect(() => {
    if (state === "succeeded")
      void qc.invalidateQueries({ queryKey: modelKeys.revision(projectId, modelId, revision) });
  }, [state, qc, projectId, modelId, revision]);

  const startRun = () =>
    start.mutate(
      { projectId, body: { kind: "attractors", modelRevisionId: revisionId, params: {} } },
      { onSuccess: (r) => setRunId(r.id) },
    );

  // Beyond the exact limit the run could only fail: say so and point to the analyses that fit.
  if (nodeCount > EXACT_SYNCHRONOUS_MAX_NODES)
    return (
      <p
        data-testid="exact-limit-note"
        className="rounded-md border border-slate-200 bg-slate-50 p-3 text-sm text-slate-700"
      >
        Exact synchronous analysis walks every state and covers at most {EXACT_SYNCHRONOUS_MAX_NODES} nodes; this model
        has {nodeCount}. Its fixed points, short cycles, trap spaces and asynchronous attractors are found by SAT in the
        analyses section below.
      </p>
    );
  return (
    <div
      data-testid="attractor-run-panel"
      className="space-y-2 rounded-md border border-slate-200 bg-slate-50 p-3 text-sm"
    >
      <p className="text-slate-700">
        This model has {plural(nodeCount, "node")} ({(2 ** nodeCount).toLocaleString()} states). Its exact synchronous
        analysis runs in the background; the result is stored with revision {revision} and reused afterwards.
      </p>
      {!runId && canStart && (
        <Button data-testid="start-attractor-run" disabled={start.isPending} onClick={startRun}>
          Compute attractors
        </Button>
      )}
      {!runId && !canStart && <p className="text-slate-600">Ask a modeler or the project owner to start it.</p>}
      {start.error && (
        <p role="alert" className="text-red-700">
          {start.error.message}
        </p>
      )}
      {run.data && (state === "queued" || state === "running") && (
        <div className="space-y-2">
          <RunProgress run={run.data} label="Attractor analysis progress" />
          {canStart && (
            <Button
              variant="secondary"
              size="sm"
              disabled={cancel.isPending}
              onClick={() => run.data && cancel.mutate(run.data)}
            >
              Cancel
            </Button>
          )}
        </div>
      )}
      {(state === "failed" || state === "cancelled") && (
        <p role="alert" className="text-red-700">
          The run {state === "failed" ? `failed: ${run.data?.error?.message ?? "unknown error"}` : "was cancelled"}.{" "}
          <button type="button" className="underline" onClick={() => setRunId(null)}>
            Start again
          </button>
        </p>
      )}
    </div>
  );
}
