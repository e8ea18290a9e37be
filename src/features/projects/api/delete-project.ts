import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const deleteProject = (projectId: string, confirmName: string) =>
  apiRequest(`/projects/${projectId}`, z.unknown(), { method: "DELETE", body: { confirmName } });

export function useDeleteProject(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (confirmName: string) => deleteProject(projectId, confirmName),
    onSuccess: () => {
      queryClient.removeQueries({ queryKey: projectKeys.project(projectId) });
      void queryClient.invalidateQueries({ queryKey: projectKeys.list() });
    },
  });
}
