import { queryOptions, useQuery } from "@tanstack/react-query";
import { Run } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { modelKeys } from "./keys";

export const getRun = (projectId: string, runId: string) => apiRequest(`/projects/${projectId}/runs/${runId}`, Run);

const isActive = (state: string | undefined) => state === "queued" || state === "running";

export const runQuery = (projectId: string, runId: string) =>
  queryOptions({
    queryKey: [...modelKeys.project(projectId), "run", runId] as const,
    queryFn: () => getRun(projectId, runId),
    // Poll while the run is queued or running; stop once it has an outcome.
    refetchInterval: (q) => (isActive(q.state.data?.state) || !q.state.data ? 1000 : false),
  });

export function useRun(projectId: string, runId: string | null) {
  return useQuery({ ...runQuery(projectId, runId ?? ""), enabled: runId !== null });
}
