import { queryOptions, useQuery } from "@tanstack/react-query";
import { RevisionList } from "@shared/schemas/models";
import { apiRequest } from "@/lib/api-client";
import { modelKeys, modelsPath } from "./keys";

export const listRevisions = (projectId: string, modelId: string) =>
  apiRequest(`${modelsPath(projectId)}/${modelId}/revisions`, RevisionList);

export const revisionListQuery = (projectId: string, modelId: string) =>
  queryOptions({ queryKey: modelKeys.revisions(projectId, modelId), queryFn: () => listRevisions(projectId, modelId) });

export function useRevisionList(projectId: string, modelId: string) {
  return useQuery(revisionListQuery(projectId, modelId));
}
