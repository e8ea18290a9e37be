import { useMutation, useQueryClient } from "@tanstack/react-query";
import { StartRunResponse, type StartRunBody } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { runKeys, runsPath } from "./keys";

export type StartRunInput = Omit<StartRunBody, "modelRevisionId"> & { modelRevisionId?: string | null };

export const startRun = (projectId: string, body: StartRunInput) =>
  apiRequest(runsPath(projectId), StartRunResponse, { method: "POST", body });

export function useStartRun(projectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: StartRunInput) => startRun(projectId, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: [...runKeys.project(projectId), "list"] }),
  });
}
