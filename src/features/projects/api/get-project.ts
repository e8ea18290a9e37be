// One project with the caller's role and capabilities, which the screens use to hide what the role forbids.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { ProjectDetail } from "@shared/schemas/projects";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const getProject = (projectId: string) => apiRequest(`/projects/${projectId}`, ProjectDetail);

export const projectQuery = (projectId: string) =>
  queryOptions({ queryKey: projectKeys.detail(projectId), queryFn: () => getProject(projectId) });

export function useProject(projectId: string) {
  return useQuery(projectQuery(projectId));
}
