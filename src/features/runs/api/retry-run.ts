import { useMutation, useQueryClient } from "@tanstack/react-query";
import { Run } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { runKeys, runPath } from "./keys";

export const retryRun = (projectId: string, runId: string) =>
  apiRequest(`${runPath(projectId, runId)}/retry`, Run, { method: "POST" });

export function useRetryRun(projectId: string, runId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => retryRun(projectId, runId),
    onSuccess: (run) => {
      qc.setQueryData(runKeys.detail(projectId, runId), run);
      return qc.invalidateQueries({ queryKey: [...runKeys.project(projectId), "list"] });
    },
  });
}
