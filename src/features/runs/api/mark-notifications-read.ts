import { useMutation, useQueryClient } from "@tanstack/react-query";
import { MarkNotificationsReadResult, type MarkNotificationsReadBody } from "@shared/schemas/runs";
import type { z } from "zod";
import { apiRequest } from "@/lib/api-client";
import { runKeys } from "./keys";

export const markNotificationsRead = (body: z.input<typeof MarkNotificationsReadBody>) =>
  apiRequest("/notifications/read", MarkNotificationsReadResult, { method: "POST", body });

export function useMarkNotificationsRead() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: markNotificationsRead,
    onSuccess: () => qc.invalidateQueries({ queryKey: runKeys.notifications() }),
  });
}
