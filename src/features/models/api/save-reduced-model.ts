// Saving a node-elimination run's reduced model: a new model of the project and a proposed reduction from its source.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { SavedReducedModel } from "@shared/schemas/reductions";
import { apiRequest } from "@/lib/api-client";

export const saveReducedModel = (projectId: string, body: { runId: string; name: string }) =>
  apiRequest(`/projects/${projectId}/reductions/reduced-models`, SavedReducedModel, { method: "POST", body });

/** The model lists and the project's reductions (keyed under "reductions", see features/reductions) go stale. */
export function useSaveReducedModel(projectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { runId: string; name: string }) => saveReducedModel(projectId, body),
    onSuccess: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: ["reductions", projectId] }),
        qc.invalidateQueries({ queryKey: ["models"] }),
      ]),
  });
}
