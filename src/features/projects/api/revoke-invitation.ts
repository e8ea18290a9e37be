import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const revokeInvitation = (projectId: string, invitationId: string) =>
  apiRequest(`/projects/${projectId}/invitations/${invitationId}`, z.unknown(), { method: "DELETE" });

export function useRevokeInvitation(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => revokeInvitation(projectId, invitationId),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: projectKeys.invitations(projectId) });
      void queryClient.invalidateQueries({ queryKey: projectKeys.audit(projectId) });
    },
  });
}
