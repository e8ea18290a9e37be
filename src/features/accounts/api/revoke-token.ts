import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { apiRequest } from "@/lib/api-client";
import { accountKeys } from "./keys";

export const revokeToken = (tokenId: string) =>
  apiRequest(`/users/me/tokens/${tokenId}`, z.unknown(), { method: "DELETE" });

export function useRevokeToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeToken,
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: accountKeys.tokens() }),
  });
}
