// The caller's role in the project, read from the project endpoint, so screens can hide what the role forbids.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { CAPABILITIES, PROJECT_ROLES } from "@shared/types/roles";
import { apiRequest } from "@/lib/api-client";
import { modelKeys } from "./keys";

const ProjectAccess = z.object({
  role: z.enum(PROJECT_ROLES).nullable(),
  capabilities: z.array(z.enum(CAPABILITIES)),
});

export const getProjectAccess = (projectId: string) => apiRequest(`/projects/${projectId}`, ProjectAccess);

export const projectAccessQuery = (projectId: string) =>
  queryOptions({ queryKey: modelKeys.access(projectId), queryFn: () => getProjectAccess(projectId), staleTime: 60_000 });

/** True when the caller may create and edit models (false while loading, so buttons appear only once allowed). */
export function useCanWriteModels(projectId: string): boolean {
  const { data } = useQuery(projectAccessQuery(projectId));
  return data?.capabilities.includes("model:write") ?? false;
}
