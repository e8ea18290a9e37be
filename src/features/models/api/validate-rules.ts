// Live editor check: the server parses the text with the same parser that stores models, so what the editor
// accepts is exactly what saving accepts.
import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { ValidateResult } from "@shared/schemas/models";
import { apiRequest } from "@/lib/api-client";
import { modelKeys, modelsPath } from "./keys";

export const validateRules = (projectId: string, ruleText: string, signal?: AbortSignal) =>
  apiRequest(`${modelsPath(projectId)}/validate`, ValidateResult, { method: "POST", body: { ruleText }, signal });

export const validateRulesQuery = (projectId: string, ruleText: string) =>
  queryOptions({
    queryKey: modelKeys.validate(projectId, ruleText),
    queryFn: ({ signal }) => validateRules(projectId, ruleText, signal),
    staleTime: Infinity,
    placeholderData: keepPreviousData,
  });

export function useValidateRules(projectId: string, ruleText: string, enabled: boolean) {
  return useQuery({ ...validateRulesQuery(projectId, ruleText), enabled });
}
