import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { SearchBody } from "@shared/schemas/reductions";
import { StartRunResponse } from "@shared/schemas/runs";
import { storeRun } from "@/features/runs";
import { apiRequest } from "@/lib/api-client";
import { reductionsPath } from "./keys";

export const startSearch = (projectId: string, body: SearchBody) =>
  apiRequest(`${reductionsPath(projectId)}/searches`, StartRunResponse, { method: "POST", body });

/** A search is a run; its reductions appear when it finishes, so the project's run lists are what go stale now. */
export function useStartSearch(projectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SearchBody) => startSearch(projectId, body),
    onSuccess: (run) => storeRun(qc, run),
  });
}
