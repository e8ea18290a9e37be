import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ReductionDetail } from "@shared/schemas/reductions";
import { apiRequest } from "@/lib/api-client";
import { reductionKeys, reductionPath } from "./keys";

export const saveTarget = (projectId: string, reductionId: string, name: string) =>
  apiRequest(`${reductionPath(projectId, reductionId)}/save-target`, ReductionDetail, {
    method: "POST",
    body: { name },
  });

/** A new model appears in the project: the model lists and the hierarchy go stale with the reduction. */
export function useSaveTarget(projectId: string, reductionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => saveTarget(projectId, reductionId, name),
    onSuccess: (data) => {
      qc.setQueryData(reductionKeys.detail(projectId, reductionId), data);
      return Promise.all([
        qc.invalidateQueries({ queryKey: reductionKeys.project(projectId) }),
        qc.invalidateQueries({ queryKey: ["models"] }),
      ]);
    },
  });
}
