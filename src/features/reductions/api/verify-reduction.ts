import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ReductionDetail } from "@shared/schemas/reductions";
import { apiRequest } from "@/lib/api-client";
import { reductionKeys, reductionPath } from "./keys";

export const verifyReduction = (projectId: string, reductionId: string) =>
  apiRequest(`${reductionPath(projectId, reductionId)}/verify`, ReductionDetail, { method: "POST" });

export function useVerifyReduction(projectId: string, reductionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => verifyReduction(projectId, reductionId),
    onSuccess: (data) => qc.setQueryData(reductionKeys.detail(projectId, reductionId), data),
  });
}
