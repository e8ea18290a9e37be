import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ModelDetail, type GenerateModelBody } from "@shared/schemas/models";
import { apiRequest } from "@/lib/api-client";
import { modelKeys, modelsPath } from "./keys";

export const generateModel = (projectId: string, body: GenerateModelBody) =>
  apiRequest(`${modelsPath(projectId)}/generate`, ModelDetail, { method: "POST", body });

export function useGenerateModel(projectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: GenerateModelBody) => generateModel(projectId, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: modelKeys.list(projectId) }),
  });
}
