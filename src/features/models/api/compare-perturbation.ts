import { useMutation } from "@tanstack/react-query";
import { PerturbationResult, type PerturbationBody } from "@shared/schemas/models";
import { apiRequest } from "@/lib/api-client";
import { revisionPath } from "./keys";

export const comparePerturbation = (projectId: string, modelId: string, revision: number, body: PerturbationBody) =>
  apiRequest(`${revisionPath(projectId, modelId, revision)}/perturbation`, PerturbationResult, {
    method: "POST",
    body,
  });

/** A computation, not a change: nothing to invalidate afterwards. */
export function useComparePerturbation(projectId: string, modelId: string, revision: number) {
  return useMutation({
    mutationFn: (body: PerturbationBody) => comparePerturbation(projectId, modelId, revision, body),
  });
}
