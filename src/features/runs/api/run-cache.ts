// The one invalidation rule of runs: when a run is started, changed or deleted, its detail entry takes what the
// server answered (or goes), and its project's run lists refetch. Nothing else about runs goes stale on a mutation:
// results appear through polling, and the features that use a result refetch it when the run has succeeded.
import type { QueryClient } from "@tanstack/react-query";
import type { Run } from "@shared/schemas/runs";
import { runKeys } from "./keys";

/** `answer` may be a start's answer, whose `reused` flag describes the request, not the run. */
export function storeRun(qc: QueryClient, answer: Run & { reused?: boolean }): Promise<void> {
  const { reused: _reused, ...run } = answer;
  qc.setQueryData(runKeys.detail(run.projectId, run.id), run);
  return qc.invalidateQueries({ queryKey: runKeys.lists(run.projectId) });
}

export function forgetRun(qc: QueryClient, run: Pick<Run, "id" | "projectId">): Promise<void> {
  qc.removeQueries({ queryKey: runKeys.detail(run.projectId, run.id) });
  return qc.invalidateQueries({ queryKey: runKeys.lists(run.projectId) });
}
