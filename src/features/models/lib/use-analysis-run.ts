// One analysis run of a revision as the model page follows it: the latest run of the kind on this revision (so a
// result computed earlier shows at once), or the one just started; start and cancel. The server answers a repeated
// request with the stored run, so starting again with the same parameters costs nothing.
import { useState } from "react";
import { isRunFinished, type Run, type StartRunBody } from "@shared/schemas/runs";
import { useCancelRun, useRun, useRunList, useStartRun } from "@/features/runs";

type AnalysisKind = "sat-cycles" | "trap-spaces" | "async-attractors" | "node-elimination";
type ParamsOf<K extends AnalysisKind> = Extract<StartRunBody, { kind: K }>["params"];

export function useAnalysisRun<K extends AnalysisKind>(projectId: string, revisionId: string, kind: K) {
  const list = useRunList(projectId, { kind });
  const start = useStartRun();
  const cancel = useCancelRun();
  const [startedId, setStartedId] = useState<string | null>(null);
  const latest = list.data?.find((r) => r.modelRevisionId === revisionId && r.state !== "cancelled");
  const runId = startedId ?? latest?.id ?? null;
  const run = useRun(projectId, runId);
  const current: Run | null = run.data ?? (latest && latest.id === runId ? latest : null);
  return {
    run: current,
    isLive: current !== null && !isRunFinished(current.state),
    start: (params: ParamsOf<K>) =>
      start.mutate(
        { projectId, body: { kind, modelRevisionId: revisionId, params } as StartRunBody },
        { onSuccess: (r) => setStartedId(r.id) },
      ),
    startError: start.error,
    isStarting: start.isPending,
    cancel: () => current && cancel.mutate(current),
    isCancelling: cancel.isPending,
  };
}
