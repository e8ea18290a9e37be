import { useMutation, useQueryClient } from "@tanstack/react-query";
import { BulkDecisionResult, type BulkDecisionBody } from "@shared/schemas/reductions";
import { apiRequest } from "@/lib/api-client";
import { reductionKeys, reductionsPath } from "./keys";

export const decideReductions = (projectId: string, body: BulkDecisionBody) =>
  apiRequest(`${reductionsPath(projectId)}/decisions`, BulkDecisionResult, { method: "POST", body });

/** The queue's bulk action changes lists, details and the hierarchy of the project alike. */
export function useDecideReductions(projectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: BulkDecisionBody) => decideReductions(projectId, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: reductionKeys.project(projectId) }),
  });
}
