import { queryOptions, useQuery } from "@tanstack/react-query";
import { NotificationList } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { runKeys } from "./keys";

export const listNotifications = () => apiRequest("/notifications", NotificationList);

/** Checked every 30 s, and only while someone is signed in (anonymous visitors would get 401 each time). */
export const notificationsQuery = () =>
  queryOptions({
    queryKey: runKeys.notifications(),
    queryFn: listNotifications,
    refetchInterval: 30_000,
    retry: false,
  });

export function useNotifications(signedIn: boolean) {
  return useQuery({ ...notificationsQuery(), enabled: signedIn });
}
