import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { Invitation } from "@shared/schemas/projects";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const listInvitations = (projectId: string) =>
  apiRequest(`/projects/${projectId}/invitations`, z.array(Invitation));

export const invitationsQuery = (projectId: string) =>
  queryOptions({ queryKey: projectKeys.invitations(projectId), queryFn: () => listInvitations(projectId) });

/** Only people who manage the project may list invitations; others never ask. */
export function useInvitations(projectId: string, enabled: boolean) {
  return useQuery({ ...invitationsQuery(projectId), enabled });
}
