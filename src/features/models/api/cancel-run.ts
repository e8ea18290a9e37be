import { useMutation, useQueryClient } from "@tanstack/react-query";
import { Run } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { modelKeys } from "./keys";

export const cancelRun = (projectId: string, runId: string) =>
  apiRequest(`/projects/${projectId}/runs/${runId}/cancel`, Run, { method: "POST" });

export function useCancelRun(projectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (runId: string) => cancelRun(projectId, runId),
    onSuccess: (_r, runId) => qc.invalidateQueries({ queryKey: [...modelKeys.project(projectId), "run", runId] }),
  });
}
