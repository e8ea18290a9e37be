import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { AuditEntry } from "@shared/schemas/projects";
import { apiRequest } from "@/lib/api-client";
import { projectKeys } from "./keys";

export const listAudit = (projectId: string) =>
  apiRequest(`/projects/${projectId}/audit?limit=200`, z.array(AuditEntry));

export const auditQuery = (projectId: string) =>
  queryOptions({ queryKey: projectKeys.audit(projectId), queryFn: () => listAudit(projectId) });

export function useAudit(projectId: string) {
  return useQuery(auditQuery(projectId));
}
