// Large state spaces are analysed by a background run (the runs API); the model page starts one for a revision.
import { useMutation } from "@tanstack/react-query";
import { StartRunResponse } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";

export const startAttractorRun = (projectId: string, revisionId: string) =>
  apiRequest(`/projects/${projectId}/runs`, StartRunResponse, {
    method: "POST",
    body: { kind: "attractors", modelRevisionId: revisionId, params: {} },
  });

export function useStartAttractorRun(projectId: string) {
  return useMutation({ mutationFn: (revisionId: string) => startAttractorRun(projectId, revisionId) });
}
