import { useMutation, useQueryClient } from "@tanstack/react-query";
import { Run } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { runPath } from "./keys";
import { storeRun } from "./run-cache";

export const cancelRun = (run: Pick<Run, "id" | "projectId">) =>
  apiRequest(`${runPath(run.projectId, run.id)}/cancel`, Run, { method: "POST" });

export function useCancelRun() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: cancelRun, onSuccess: (run) => storeRun(qc, run) });
}
