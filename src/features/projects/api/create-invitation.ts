import { useMutation, useQueryClient } from "@tanstack/react-query";
import { Invitation, type CreateInvitationBody } from "@shared/schemas/projects";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const createInvitation = (projectId: string, body: CreateInvitationBody) =>
  apiRequest(`/projects/${projectId}/invitations`, Invitation, { method: "POST", body });

export function useCreateInvitation(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateInvitationBody) => createInvitation(projectId, body),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: projectKeys.invitations(projectId) });
      void queryClient.invalidateQueries({ queryKey: projectKeys.audit(projectId) });
    },
  });
}
