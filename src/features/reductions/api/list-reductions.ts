import { queryOptions, useQuery } from "@tanstack/react-query";
import { ReductionList } from "@shared/schemas/reductions";
import { apiRequest } from "@/lib/api-client";
import { reductionKeys, reductionsPath, type ReductionFilter } from "./keys";

export function listReductions(projectId: string, f: ReductionFilter) {
  const q = new URLSearchParams(
    Object.entries(f)
      .filter(([, v]) => v !== undefined && v !== "")
      .map(([k, v]) => [k, String(v)]),
  ).toString();
  return apiRequest(`${reductionsPath(projectId)}${q ? `?${q}` : ""}`, ReductionList);
}

export const reductionsQuery = (projectId: string, f: ReductionFilter) =>
  queryOptions({ queryKey: reductionKeys.list(projectId, f), queryFn: () => listReductions(projectId, f) });

export function useReductions(projectId: string, f: ReductionFilter) {
  return useQuery(reductionsQuery(projectId, f));
}
