// One background run, polled while it is going so the progress bar moves; stops polling once it has finished.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { isRunFinished, Run } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { automataKeys } from "./keys";

export const getRun = (projectId: string, runId: string) => apiRequest(`/projects/${projectId}/runs/${runId}`, Run);

export const runQuery = (projectId: string, runId: string) =>
  queryOptions({
    queryKey: [...automataKeys.all, "run", projectId, runId] as const,
    queryFn: () => getRun(projectId, runId),
    refetchInterval: (q) => (q.state.data && isRunFinished(q.state.data.state) ? false : 1000),
  });

export function useRun(projectId: string | null, runId: string | null) {
  return useQuery({ ...runQuery(projectId ?? "", runId ?? ""), enabled: projectId !== null && runId !== null });
}
