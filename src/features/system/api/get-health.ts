import { queryOptions, useQuery } from "@tanstack/react-query";
import { Health } from "@shared/schemas/health";
import { apiRequest } from "@/lib/api-client";

export const systemKeys = { all: ["system"] as const, health: () => [...systemKeys.all, "health"] as const };

export const healthQuery = () =>
  queryOptions({
    queryKey: systemKeys.health(),
    queryFn: () => apiRequest("/health", Health),
    refetchInterval: 30_000,
    retry: false,
  });

export function useHealth() {
  return useQuery(healthQuery());
}
