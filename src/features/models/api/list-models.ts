import { queryOptions, useQuery } from "@tanstack/react-query";
import { ModelList } from "@shared/schemas/models";
import { apiRequest } from "@/lib/api-client";
import { modelKeys, modelsPath } from "./keys";

export const listModels = (projectId: string) => apiRequest(modelsPath(projectId), ModelList);

export const modelListQuery = (projectId: string) =>
  queryOptions({ queryKey: modelKeys.list(projectId), queryFn: () => listModels(projectId) });

export function useModelList(projectId: string) {
  return useQuery(modelListQuery(projectId));
}
