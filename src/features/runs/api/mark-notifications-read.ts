import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { apiRequest } from "@/lib/api-client";
import { runKeys } from "./keys";

export const markNotificationsRead = (body: { ids?: string[]; all?: boolean }) =>
  apiRequest("/notifications/read", z.object({ marked: z.number() }), { method: "POST", body });

export function useMarkNotificationsRead() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: markNotificationsRead,
    onSuccess: () => qc.invalidateQueries({ queryKey: runKeys.notifications() }),
  });
}
