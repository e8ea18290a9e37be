import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { Member } from "@shared/schemas/projects";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const listMembers = (projectId: string) => apiRequest(`/projects/${projectId}/members`, z.array(Member));

export const membersQuery = (projectId: string) =>
  queryOptions({ queryKey: projectKeys.members(projectId), queryFn: () => listMembers(projectId) });

export function useMembers(projectId: string) {
  return useQuery(membersQuery(projectId));
}
