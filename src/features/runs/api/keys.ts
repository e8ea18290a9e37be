// Query keys of the runs feature, widest first: invalidating runKeys.project(id) refreshes lists and details.
export interface RunFilter {
  kind?: string;
  state?: string;
}

export const runKeys = {
  all: ["runs"] as const,
  project: (projectId: string) => [...runKeys.all, projectId] as const,
  list: (projectId: string, filter: RunFilter) => [...runKeys.project(projectId), "list", filter] as const,
  detail: (projectId: string, runId: string) => [...runKeys.project(projectId), "detail", runId] as const,
  notifications: () => [...runKeys.all, "notifications"] as const,
};

export const runsPath = (projectId: string) => `/projects/${projectId}/runs`;
export const runPath = (projectId: string, runId: string) => `${runsPath(projectId)}/${runId}`;
