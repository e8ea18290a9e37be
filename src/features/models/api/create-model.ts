import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ModelDetail, type CreateModelBody } from "@shared/schemas/models";
import { apiRequest } from "@/lib/api-client";
import { modelKeys, modelsPath } from "./keys";

export const createModel = (projectId: string, body: CreateModelBody) =>
  apiRequest(modelsPath(projectId), ModelDetail, { method: "POST", body });

export function useCreateModel(projectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateModelBody) => createModel(projectId, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: modelKeys.list(projectId) }),
  });
}
