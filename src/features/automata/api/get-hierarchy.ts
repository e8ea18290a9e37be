import { queryOptions, useQuery } from "@tanstack/react-query";
import { Hierarchy, type HierarchyParameters } from "@shared/schemas/automata";
import { apiRequest } from "@/lib/api-client";
import { automataKeys, parameterQuery } from "./keys";

export const getHierarchy = (p: HierarchyParameters) =>
  apiRequest(`/automata/hierarchy?${parameterQuery(p)}`, Hierarchy);

export const hierarchyQuery = (p: HierarchyParameters) =>
  queryOptions({ queryKey: automataKeys.hierarchy(p), queryFn: () => getHierarchy(p), staleTime: Infinity });

export function useHierarchy(p: HierarchyParameters) {
  return useQuery(hierarchyQuery(p));
}
