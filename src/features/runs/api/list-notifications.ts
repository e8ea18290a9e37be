import { queryOptions, useQuery } from "@tanstack/react-query";
import { NotificationList } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { runKeys } from "./keys";

export const listNotifications = () => apiRequest("/notifications", NotificationList);

/** Checked every 30 s; anonymous visitors get 401, which the bell shows as nothing. */
export const notificationsQuery = () =>
  queryOptions({
    queryKey: runKeys.notifications(),
    queryFn: listNotifications,
    refetchInterval: 30_000,
    retry: false,
  });

export function useNotifications() {
  return useQuery(notificationsQuery());
}
