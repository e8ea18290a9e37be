import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ProjectDetail, type UpdateProjectBody } from "@shared/schemas/projects";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const updateProject = (projectId: string, body: UpdateProjectBody) =>
  apiRequest(`/projects/${projectId}`, ProjectDetail, { method: "PATCH", body });

export function useUpdateProject(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateProjectBody) => updateProject(projectId, body),
    onSuccess: (project) => {
      queryClient.setQueryData(projectKeys.detail(projectId), project);
      void queryClient.invalidateQueries({ queryKey: projectKeys.list() });
      void queryClient.invalidateQueries({ queryKey: projectKeys.audit(projectId) });
    },
  });
}
