// The eca-hierarchy runs of one project, so a page opened later still finds the run it started and its progress.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { isRunFinished, RunList } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { automataKeys } from "./keys";

export const getHierarchyRuns = (projectId: string) =>
  apiRequest(`/projects/${projectId}/runs?kind=eca-hierarchy&limit=50`, RunList);

export const hierarchyRunsQuery = (projectId: string) =>
  queryOptions({
    queryKey: [...automataKeys.all, "runs", projectId] as const,
    queryFn: () => getHierarchyRuns(projectId),
    refetchInterval: (q) => (q.state.data?.some((r) => !isRunFinished(r.state)) ? 2000 : false),
  });

export function useHierarchyRuns(projectId: string | null) {
  return useQuery({ ...hierarchyRunsQuery(projectId ?? ""), enabled: projectId !== null && projectId !== "" });
}
