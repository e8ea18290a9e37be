// Query keys of the models feature, widest first so an invalidation can pick the narrowest prefix it needs.
export const modelKeys = {
  all: ["models"] as const,
  project: (projectId: string) => [...modelKeys.all, projectId] as const,
  list: (projectId: string) => [...modelKeys.project(projectId), "list"] as const,
  model: (projectId: string, modelId: string) => [...modelKeys.project(projectId), "model", modelId] as const,
  detail: (projectId: string, modelId: string, revision: number | "latest") =>
    [...modelKeys.model(projectId, modelId), "detail", revision] as const,
  revisions: (projectId: string, modelId: string) => [...modelKeys.model(projectId, modelId), "revisions"] as const,
  revision: (projectId: string, modelId: string, revision: number) =>
    [...modelKeys.model(projectId, modelId), "revision", revision] as const,
  validate: (projectId: string, ruleText: string) => [...modelKeys.project(projectId), "validate", ruleText] as const,
};

export function modelsPath(projectId: string): string {
  return `/projects/${projectId}/models`;
}

export function revisionPath(projectId: string, modelId: string, revision: number): string {
  return `${modelsPath(projectId)}/${modelId}/revisions/${revision}`;
}
