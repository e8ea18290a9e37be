import { useMutation } from "@tanstack/react-query";
import { z } from "zod";
import { apiRequest } from "@/lib/api-client";

export const signOut = () => apiRequest("/auth/sign-out", z.unknown(), { method: "POST" });

/**
 * Nothing cached for the previous person may show after sign-out, and the next person must not be sent back to
 * the page the last one had open: a full load of the plain sign-in page does both at once (resetting the cache
 * in place let the sign-in guard record that page as `next` first).
 */
export function useSignOut() {
  return useMutation({ mutationFn: signOut, onSuccess: () => window.location.replace("/sign-in") });
}
