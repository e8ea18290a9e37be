import { queryOptions, useQuery } from "@tanstack/react-query";
import { Run, isRunFinished } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { runKeys, runPath } from "./keys";

export const getRun = (projectId: string, runId: string) => apiRequest(runPath(projectId, runId), Run);

/** Polls once a second while the run is queued or running (or not loaded yet); stops once it has finished. */
export const runQuery = (projectId: string, runId: string) =>
  queryOptions({
    queryKey: runKeys.detail(projectId, runId),
    queryFn: () => getRun(projectId, runId),
    refetchInterval: (q) => (q.state.data && isRunFinished(q.state.data.state) ? false : 1000),
  });

/** One run; nothing is fetched while either id is null (no run started yet). */
export function useRun(projectId: string | null, runId: string | null) {
  return useQuery({ ...runQuery(projectId ?? "", runId ?? ""), enabled: projectId !== null && runId !== null });
}
