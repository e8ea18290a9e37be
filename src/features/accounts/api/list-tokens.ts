import { queryOptions, useQuery } from "@tanstack/react-query";
import { AccessTokenList } from "@shared/schemas/access-tokens";
import { apiRequest } from "@/lib/api-client";
import { accountKeys } from "./keys";

export const listTokens = () => apiRequest("/users/me/tokens", AccessTokenList);

export const tokensQuery = () => queryOptions({ queryKey: accountKeys.tokens(), queryFn: listTokens });

export function useTokens() {
  return useQuery(tokensQuery());
}
