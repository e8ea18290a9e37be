import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { apiRequest } from "@/lib/api-client";

export const signOut = () => apiRequest("/auth/sign-out", z.unknown(), { method: "POST" });

/** Nothing cached for the previous person may show after sign-out. */
export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: signOut, onSuccess: () => queryClient.resetQueries() });
}
