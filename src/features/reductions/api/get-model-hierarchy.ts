import { queryOptions, useQuery } from "@tanstack/react-query";
import { HierarchyGraph } from "@shared/schemas/reductions";
import { apiRequest } from "@/lib/api-client";
import { reductionKeys } from "./keys";

export const getModelHierarchy = (projectId: string) =>
  apiRequest(`/projects/${projectId}/model-hierarchy`, HierarchyGraph);

export const modelHierarchyQuery = (projectId: string) =>
  queryOptions({ queryKey: reductionKeys.hierarchy(projectId), queryFn: () => getModelHierarchy(projectId) });

export function useModelHierarchy(projectId: string) {
  return useQuery(modelHierarchyQuery(projectId));
}
