// Query keys of the projects feature, widest first so an invalidation can pick the narrowest prefix it needs.
export const projectKeys = {
  all: ["projects"] as const,
  list: () => [...projectKeys.all, "list"] as const,
  project: (projectId: string) => [...projectKeys.all, projectId] as const,
  detail: (projectId: string) => [...projectKeys.project(projectId), "detail"] as const,
  members: (projectId: string) => [...projectKeys.project(projectId), "members"] as const,
  invitations: (projectId: string) => [...projectKeys.project(projectId), "invitations"] as const,
  audit: (projectId: string) => [...projectKeys.project(projectId), "audit"] as const,
  invitationPreview: (token: string) => [...projectKeys.all, "invitation", token] as const,
};
