import { useMutation, useQueryClient } from "@tanstack/react-query";
import { StartRunResponse, type StartRunBody } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { runsPath } from "./keys";
import { storeRun } from "./run-cache";

export type StartRunInput = Omit<StartRunBody, "modelRevisionId"> & { modelRevisionId?: string | null };

export const startRun = (projectId: string, body: StartRunInput) =>
  apiRequest(runsPath(projectId), StartRunResponse, { method: "POST", body });

/** Starts a run in the given project (or answers the stored run of the same request, with `reused`). */
export function useStartRun() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ projectId, body }: { projectId: string; body: StartRunInput }) => startRun(projectId, body),
    onSuccess: (run) => storeRun(qc, run),
  });
}
