import { useMutation, useQueryClient } from "@tanstack/react-query";
import { SessionUser, type SignUpBody } from "@shared/schemas/accounts";
import { apiRequest } from "@/lib/api-client";

export const signUp = (body: SignUpBody) => apiRequest("/auth/sign-up", SessionUser, { method: "POST", body });

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: signUp, onSuccess: () => queryClient.resetQueries() });
}
