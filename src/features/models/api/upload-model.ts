import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ModelDetail, UploadPreview } from "@shared/schemas/models";
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

/** Reads the file on the server without storing it (what it holds, warnings, models with the same content). */
export function previewUpload(projectId: string, file: File) {
  const form = new FormData();
  form.append("file", file);
  return apiRequest(`${modelsPath(projectId)}/upload/preview`, UploadPreview, { method: "POST", formData: form });
}

export function usePreviewUpload(projectId: string) {
  return useMutation({ mutationFn: (file: File) => previewUpload(projectId, file) });
}
