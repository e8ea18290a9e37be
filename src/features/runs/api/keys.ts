// Query keys of runs, widest first: runKeys.project(id) covers a project's lists and details, runKeys.lists(id)
// only its lists. Every feature that shows runs uses these keys (through the runs feature's index.ts), so one URL has
// one cache entry and one polling rule.
export interface RunFilter {
  kind?: string;
  state?: string;
}

export const runKeys = {
  all: ["runs"] as const,
  project: (projectId: string) => [...runKeys.all, projectId] as const,
  lists: (projectId: string) => [...runKeys.project(projectId), "list"] as const,
  list: (projectId: string, filter: RunFilter) => [...runKeys.lists(projectId), filter] as const,
  detail: (projectId: string, runId: string) => [...runKeys.project(projectId), "detail", runId] as const,
  notifications: () => [...runKeys.all, "notifications"] as const,
};

export const runsPath = (projectId: string) => `/projects/${projectId}/runs`;
export const runPath = (projectId: string, runId: string) => `${runsPath(projectId)}/${runId}`;
