import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ReductionDetail } from "@shared/schemas/reductions";
import { runKeys } from "@/features/runs";
import { apiRequest } from "@/lib/api-client";
import { reductionKeys, reductionsPath } from "./keys";

export const proposeFinding = (projectId: string, runId: string, rank: number) =>
  apiRequest(`${reductionsPath(projectId)}/proposals`, ReductionDetail, { method: "POST", body: { runId, rank } });

/** The reduction enters the queue and the run's result records it, so both go stale. */
export function useProposeFinding(projectId: string, runId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (rank: number) => proposeFinding(projectId, runId, rank),
    onSuccess: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: reductionKeys.project(projectId) }),
        qc.invalidateQueries({ queryKey: runKeys.detail(projectId, runId) }),
      ]),
  });
}
