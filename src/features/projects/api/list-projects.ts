import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { ProjectListItem } from "@shared/schemas/projects";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const listProjects = () => apiRequest("/projects", z.array(ProjectListItem));

export const projectsQuery = () => queryOptions({ queryKey: projectKeys.list(), queryFn: listProjects });

export function useProjects() {
  return useQuery(projectsQuery());
}
