import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ModelDetail, type NewRevisionBody } from "@shared/schemas/models";
import { apiRequest } from "@/lib/api-client";
import { modelKeys, modelsPath } from "./keys";

export const createRevision = (projectId: string, modelId: string, body: NewRevisionBody) =>
  apiRequest(`${modelsPath(projectId)}/${modelId}/revisions`, ModelDetail, { method: "POST", body });

export function useCreateRevision(projectId: string, modelId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: NewRevisionBody) => createRevision(projectId, modelId, body),
    onSuccess: async () => {
      await Promise.all([
        qc.invalidateQueries({ queryKey: modelKeys.model(projectId, modelId) }),
        qc.invalidateQueries({ queryKey: modelKeys.list(projectId) }),
      ]);
    },
  });
}
