import { useMutation, useQueryClient } from "@tanstack/react-query";
import { Run } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { runPath } from "./keys";
import { storeRun } from "./run-cache";

export const retryRun = (run: Pick<Run, "id" | "projectId">) =>
  apiRequest(`${runPath(run.projectId, run.id)}/retry`, Run, { method: "POST" });

export function useRetryRun() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: retryRun, onSuccess: (run) => storeRun(qc, run) });
}
