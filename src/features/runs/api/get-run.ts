import { queryOptions, useQuery } from "@tanstack/react-query";
import { Run, isRunFinished } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { runKeys, runPath } from "./keys";

export const getRun = (projectId: string, runId: string) => apiRequest(runPath(projectId, runId), Run);

/** Polls once a second while the run is live; stops as soon as it has finished. */
export const runQuery = (projectId: string, runId: string) =>
  queryOptions({
    queryKey: runKeys.detail(projectId, runId),
    queryFn: () => getRun(projectId, runId),
    refetchInterval: (q) => (q.state.data && isRunFinished(q.state.data.state) ? false : 1000),
  });

export function useRun(projectId: string, runId: string) {
  return useQuery(runQuery(projectId, runId));
}
