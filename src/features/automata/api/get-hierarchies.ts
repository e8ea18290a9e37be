import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { HierarchySummary } from "@shared/schemas/automata";
import { apiRequest } from "@/lib/api-client";
import { automataKeys } from "./keys";

const HierarchyList = z.array(HierarchySummary);

export const getHierarchies = () => apiRequest("/automata/hierarchies", HierarchyList);

export const hierarchiesQuery = () => queryOptions({ queryKey: automataKeys.hierarchies(), queryFn: getHierarchies });

export function useHierarchies() {
  return useQuery(hierarchiesQuery());
}
