import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ModelDetail } from "@shared/schemas/models";
import { apiRequest } from "@/lib/api-client";
import { modelKeys, modelsPath } from "./keys";

export interface UploadInput {
  file: File;
  name?: string;
}

export function uploadModel(projectId: string, { file, name }: UploadInput) {
  const form = new FormData();
  if (name) form.append("name", name);
  form.append("file", file);
  return apiRequest(`${modelsPath(projectId)}/upload`, ModelDetail, { method: "POST", formData: form });
}

export function useUploadModel(projectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UploadInput) => uploadModel(projectId, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: modelKeys.list(projectId) }),
  });
}
