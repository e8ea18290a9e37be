import { queryOptions, useQuery } from "@tanstack/react-query";
import { RunList, isRunFinished } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { runKeys, runsPath, type RunFilter } from "./keys";

export const listRuns = (projectId: string, filter: RunFilter) => {
  const q = new URLSearchParams();
  if (filter.kind) q.set("kind", filter.kind);
  if (filter.state) q.set("state", filter.state);
  const query = q.toString();
  return apiRequest(`${runsPath(projectId)}${query ? `?${query}` : ""}`, RunList);
};

/** The list refreshes every 2 s while any listed run is still queued or running. */
export const runListQuery = (projectId: string, filter: RunFilter) =>
  queryOptions({
    queryKey: runKeys.list(projectId, filter),
    queryFn: () => listRuns(projectId, filter),
    refetchInterval: (q) => (q.state.data?.some((r) => !isRunFinished(r.state)) ? 2000 : false),
  });

/** A project's runs; nothing is fetched while the project is not chosen (null or ""). */
export function useRunList(projectId: string | null, filter: RunFilter = {}) {
  return useQuery({ ...runListQuery(projectId ?? "", filter), enabled: Boolean(projectId) });
}
