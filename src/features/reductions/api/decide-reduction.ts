import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ReductionDetail, type DecisionBody } from "@shared/schemas/reductions";
import { apiRequest } from "@/lib/api-client";
import { reductionKeys, reductionPath } from "./keys";

export const decideReduction = (projectId: string, reductionId: string, body: DecisionBody) =>
  apiRequest(`${reductionPath(projectId, reductionId)}/decision`, ReductionDetail, { method: "POST", body });

/** A decision changes the lists and the model hierarchy of the project, so the whole project prefix goes stale. */
export function useDecideReduction(projectId: string, reductionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: DecisionBody) => decideReduction(projectId, reductionId, body),
    onSuccess: (data) => {
      qc.setQueryData(reductionKeys.detail(projectId, reductionId), data);
      return qc.invalidateQueries({ queryKey: reductionKeys.project(projectId) });
    },
  });
}
