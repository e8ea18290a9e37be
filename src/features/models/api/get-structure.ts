import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { StructureResult } from "@shared/schemas/models";
import { apiRequest } from "@/lib/api-client";
import { modelKeys, revisionPath } from "./keys";

export const getStructure = (projectId: string, modelId: string, revision: number) =>
  apiRequest(`${revisionPath(projectId, modelId, revision)}/structure`, StructureResult);

export const structureQuery = (projectId: string, modelId: string, revision: number) =>
  queryOptions({
    queryKey: [...modelKeys.revision(projectId, modelId, revision), "structure"] as const,
    queryFn: () => getStructure(projectId, modelId, revision),
    staleTime: Infinity,
  });

export function useStructure(projectId: string, modelId: string, revision: number, enabled = true) {
  return useQuery({ ...structureQuery(projectId, modelId, revision), enabled, placeholderData: keepPreviousData });
}
