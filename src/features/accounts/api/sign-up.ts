import { useMutation, useQueryClient } from "@tanstack/react-query";
import { SessionUser, SignUpAccepted, type SignUpBody } from "@shared/schemas/accounts";
import { apiRequest } from "@/lib/api-client";

export const signUp = (body: SignUpBody) => apiRequest("/auth/sign-up", SignUpAccepted, { method: "POST", body });

export const confirmSignUp = (token: string) =>
  apiRequest("/auth/sign-up/confirm", SessionUser, { method: "POST", body: { token } });

export function useSignUp() {
  return useMutation({ mutationFn: signUp });
}

export function useConfirmSignUp() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: confirmSignUp, onSuccess: () => queryClient.resetQueries() });
}
