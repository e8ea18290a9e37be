// Who may do what. The server enforces it (one middleware), the client uses the same table to hide what a role
// cannot do. Project roles are not a strict ladder (a reviewer approves results but does not edit models), so
// routes ask for a capability, never for a role name.

export const SITE_ROLES = ["admin", "member"] as const;
export type SiteRole = (typeof SITE_ROLES)[number];

export const PROJECT_ROLES = ["owner", "modeler", "reviewer", "viewer"] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

export const CAPABILITIES = [
  "project:read", // see the project, its models, runs, reductions, audit log
  "project:manage", // rename, archive, delete, change roles, invite and remove members
  "model:write", // create, import, edit models
  "run:start", // start, cancel, retry and delete analyses and searches
  "review:decide", // approve or reject reductions, ask for re-verification
  "comment:write", // take part in review threads
] as const;
export type Capability = (typeof CAPABILITIES)[number];

const grants: Record<ProjectRole, readonly Capability[]> = {
  owner: CAPABILITIES,
  modeler: ["project:read", "model:write", "run:start", "comment:write"],
  reviewer: ["project:read", "review:decide", "comment:write"],
  viewer: ["project:read"],
};

/** Site admins act as owners in every project, whether or not they are members. */
export function can(role: ProjectRole | null, siteRole: SiteRole, capability: Capability): boolean {
  if (siteRole === "admin") return true;
  return role !== null && grants[role].includes(capability);
}

export function capabilitiesOf(role: ProjectRole | null, siteRole: SiteRole): Capability[] {
  return CAPABILITIES.filter((c) => can(role, siteRole, c));
}
