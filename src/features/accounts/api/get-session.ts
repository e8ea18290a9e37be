// Who is signed in (null when nobody) and whether the mailbox page exists for them.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { Session } from "@shared/schemas/accounts";
import { apiRequest } from "@/lib/api-client";
import { accountKeys } from "./keys";

export const getSession = () => apiRequest("/auth/session", Session);

export const sessionQuery = () =>
  queryOptions({ queryKey: accountKeys.session(), queryFn: getSession, staleTime: 60_000 });

export function useSession() {
  return useQuery(sessionQuery());
}
