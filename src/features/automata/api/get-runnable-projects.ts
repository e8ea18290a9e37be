// The projects where the caller may start runs: a background hierarchy run is started in one of them.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { Session } from "@shared/schemas/accounts";
import { ProjectListItem } from "@shared/schemas/projects";
import { can } from "@shared/types/roles";
import { apiRequest } from "@/lib/api-client";
import { automataKeys } from "./keys";

export async function getRunnableProjects() {
  const [session, projects] = await Promise.all([
    apiRequest("/auth/session", Session),
    apiRequest("/projects", z.array(ProjectListItem)),
  ]);
  const siteRole = session.user?.siteRole ?? "member";
  return projects.filter((p) => !p.archived && can(p.role, siteRole, "run:start"));
}

export const runnableProjectsQuery = () =>
  queryOptions({ queryKey: [...automataKeys.all, "runnable-projects"] as const, queryFn: getRunnableProjects });

export function useRunnableProjects(enabled: boolean) {
  return useQuery({ ...runnableProjectsQuery(), enabled });
}
