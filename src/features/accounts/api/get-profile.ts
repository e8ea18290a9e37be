import { queryOptions, useQuery } from "@tanstack/react-query";
import { Profile } from "@shared/schemas/accounts";
import { apiRequest } from "@/lib/api-client";
import { accountKeys } from "./keys";

export const getProfile = () => apiRequest("/users/me", Profile);

export const profileQuery = () => queryOptions({ queryKey: accountKeys.profile(), queryFn: getProfile });

export function useProfile() {
  return useQuery(profileQuery());
}
