import { useMutation, useQueryClient } from "@tanstack/react-query";
import { AcceptedInvitation, type AcceptInvitationBody } from "@shared/schemas/projects";
import { apiRequest } from "@/lib/api-client";

export const acceptInvitation = (token: string, body: AcceptInvitationBody) =>
  apiRequest(`/invitations/${encodeURIComponent(token)}/accept`, AcceptedInvitation, { method: "POST", body });

/** Accepting may sign a new account in and adds a project, so every cached answer is refetched. */
export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptInvitationBody) => acceptInvitation(token, body),
    onSuccess: () => queryClient.resetQueries(),
  });
}
