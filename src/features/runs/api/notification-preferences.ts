import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { NotificationPreferences } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { runKeys } from "./keys";

const path = "/notifications/preferences";
const key = () => [...runKeys.notifications(), "preferences"] as const;

export const notificationPreferencesQuery = () =>
  queryOptions({ queryKey: key(), queryFn: () => apiRequest(path, NotificationPreferences) });

export function useNotificationPreferences() {
  return useQuery(notificationPreferencesQuery());
}

export function useSaveNotificationPreferences() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: NotificationPreferences) => apiRequest(path, NotificationPreferences, { method: "PATCH", body }),
    onSuccess: (data) => qc.setQueryData(key(), data),
  });
}
