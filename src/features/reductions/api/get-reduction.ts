import { queryOptions, useQuery } from "@tanstack/react-query";
import { ReductionDetail } from "@shared/schemas/reductions";
import { apiRequest } from "@/lib/api-client";
import { reductionKeys, reductionPath } from "./keys";

export const getReduction = (projectId: string, reductionId: string) =>
  apiRequest(reductionPath(projectId, reductionId), ReductionDetail);

export const reductionQuery = (projectId: string, reductionId: string) =>
  queryOptions({
    queryKey: reductionKeys.detail(projectId, reductionId),
    queryFn: () => getReduction(projectId, reductionId),
  });

export function useReduction(projectId: string, reductionId: string) {
  return useQuery(reductionQuery(projectId, reductionId));
}
