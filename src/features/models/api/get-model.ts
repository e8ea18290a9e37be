import { queryOptions, useQuery } from "@tanstack/react-query";
import { ModelDetail } from "@shared/schemas/models";
import { apiRequest } from "@/lib/api-client";
import { modelKeys, modelsPath, revisionPath } from "./keys";

/** The model with its latest revision, or with the given revision. */
export const getModel = (projectId: string, modelId: string, revision: number | "latest") =>
  apiRequest(
    revision === "latest" ? `${modelsPath(projectId)}/${modelId}` : revisionPath(projectId, modelId, revision),
    ModelDetail,
  );

export const modelQuery = (projectId: string, modelId: string, revision: number | "latest" = "latest") =>
  queryOptions({
    queryKey: modelKeys.detail(projectId, modelId, revision),
    queryFn: () => getModel(projectId, modelId, revision),
  });

export function useModel(projectId: string, modelId: string, revision: number | "latest" = "latest") {
  return useQuery(modelQuery(projectId, modelId, revision));
}
