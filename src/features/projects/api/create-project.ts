import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ProjectListItem, type CreateProjectBody } from "@shared/schemas/projects";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const createProject = (body: CreateProjectBody) =>
  apiRequest("/projects", ProjectListItem, { method: "POST", body });

export function useCreateProject() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createProject,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: projectKeys.list() }),
  });
}
