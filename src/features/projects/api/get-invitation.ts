// What an invitation link offers, read before accepting it.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { InvitationPreview } from "@shared/schemas/projects";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const getInvitation = (token: string) =>
  apiRequest(`/invitations/${encodeURIComponent(token)}`, InvitationPreview);

export const invitationQuery = (token: string) =>
  queryOptions({ queryKey: projectKeys.invitationPreview(token), queryFn: () => getInvitation(token) });

export function useInvitationPreview(token: string) {
  return useQuery(invitationQuery(token));
}
