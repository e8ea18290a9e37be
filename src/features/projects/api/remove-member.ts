import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const removeMember = (projectId: string, userId: string) =>
  apiRequest(`/projects/${projectId}/members/${userId}`, z.unknown(), { method: "DELETE" });

export function useRemoveMember(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeMember(projectId, userId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: projectKeys.project(projectId) }),
  });
}
