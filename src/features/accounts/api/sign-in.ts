import { useMutation, useQueryClient } from "@tanstack/react-query";
import { SessionUser, type SignInBody } from "@shared/schemas/accounts";
import { apiRequest } from "@/lib/api-client";

export const signIn = (body: SignInBody) => apiRequest("/auth/sign-in", SessionUser, { method: "POST", body });

/** A new person means every cached answer may differ, so the whole cache is dropped. */
export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: signIn, onSuccess: () => queryClient.resetQueries() });
}
