import { useMutation, useQueryClient } from "@tanstack/react-query";
import { CreatedAccessToken, type NewAccessTokenBody } from "@shared/schemas/access-tokens";
import { apiRequest } from "@/lib/api-client";
import { accountKeys } from "./keys";

export const createToken = (body: NewAccessTokenBody) =>
  apiRequest("/users/me/tokens", CreatedAccessToken, { method: "POST", body });

export function useCreateToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createToken,
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: accountKeys.tokens() }),
  });
}
