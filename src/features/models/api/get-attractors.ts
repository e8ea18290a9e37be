import { queryOptions, useQuery } from "@tanstack/react-query";
import { SynchronousResult } from "@shared/schemas/models";
import { apiRequest } from "@/lib/api-client";
import { modelKeys, revisionPath } from "./keys";

export const getAttractors = (projectId: string, modelId: string, revision: number, markers: readonly string[]) =>
  apiRequest(
    `${revisionPath(projectId, modelId, revision)}/attractors?markers=${encodeURIComponent(markers.join(","))}`,
    SynchronousResult,
  );

export const attractorsQuery = (projectId: string, modelId: string, revision: number, markers: readonly string[]) =>
  queryOptions({
    queryKey: [...modelKeys.revision(projectId, modelId, revision), "attractors", markers.join(",")] as const,
    queryFn: () => getAttractors(projectId, modelId, revision, markers),
    // A revision never changes, so its attractors never go stale.
    staleTime: Infinity,
    retry: false,
  });

export function useAttractors(
  projectId: string,
  modelId: string,
  revision: number,
  markers: readonly string[],
  enabled = true,
) {
  return useQuery({ ...attractorsQuery(projectId, modelId, revision, markers), enabled });
}
