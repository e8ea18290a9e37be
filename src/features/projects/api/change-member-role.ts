import { useMutation, useQueryClient } from "@tanstack/react-query";
import { Member } from "@shared/schemas/projects";
import type { ProjectRole } from "@shared/types/roles";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const changeMemberRole = (projectId: string, userId: string, role: ProjectRole) =>
  apiRequest(`/projects/${projectId}/members/${userId}`, Member, { method: "PATCH", body: { role } });

/** A role change may be the caller's own, so the project (with its capabilities) is refreshed too. */
export function useChangeMemberRole(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: ProjectRole }) => changeMemberRole(projectId, userId, role),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: projectKeys.project(projectId) }),
  });
}
