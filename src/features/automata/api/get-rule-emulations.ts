import { queryOptions, useQuery } from "@tanstack/react-query";
import { RuleEmulations, type HierarchyParameters } from "@shared/schemas/automata";
import { apiRequest } from "@/lib/api-client";
import { automataKeys, parameterQuery } from "./keys";

export const getRuleEmulations = (rule: number, p: HierarchyParameters) =>
  apiRequest(`/automata/rules/${rule}?${parameterQuery(p)}`, RuleEmulations);

export const ruleEmulationsQuery = (rule: number, p: HierarchyParameters) =>
  queryOptions({
    queryKey: automataKeys.rule(rule, p),
    queryFn: () => getRuleEmulations(rule, p),
    staleTime: Infinity,
  });

export function useRuleEmulations(rule: number, p: HierarchyParameters) {
  return useQuery(ruleEmulationsQuery(rule, p));
}
