import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { apiRequest } from "@/lib/api-client";
import { runKeys, runPath } from "./keys";

export const deleteRun = (projectId: string, runId: string) =>
  apiRequest(runPath(projectId, runId), z.unknown(), { method: "DELETE" });

export function useDeleteRun(projectId: string, runId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => deleteRun(projectId, runId),
    onSuccess: () => {
      qc.removeQueries({ queryKey: runKeys.detail(projectId, runId) });
      return qc.invalidateQueries({ queryKey: [...runKeys.project(projectId), "list"] });
    },
  });
}
