// Downloads are plain links (the browser handles the attachment); this only builds their addresses.
import type { ExportFormat } from "@shared/schemas/models";
import { revisionPath } from "./keys";

export function exportUrl(projectId: string, modelId: string, revision: number, format: ExportFormat): string {
  return `/api${revisionPath(projectId, modelId, revision)}/export?format=${format}`;
}

export function originalFileUrl(projectId: string, modelId: string, revision: number): string {
  return `/api${revisionPath(projectId, modelId, revision)}/original`;
}
