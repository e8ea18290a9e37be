// Starts a background "eca-hierarchy" run in a project; the runs queue reuses an identical run already going.
import { useMutation } from "@tanstack/react-query";
import { StartRunResponse } from "@shared/schemas/runs";
import type { HierarchyRunParameters } from "@shared/schemas/automata";
import { apiRequest } from "@/lib/api-client";

export const startHierarchyRun = (projectId: string, params: HierarchyRunParameters) =>
  apiRequest(`/projects/${projectId}/runs`, StartRunResponse, {
    method: "POST",
    body: { kind: "eca-hierarchy", modelRevisionId: null, params },
  });

export function useStartHierarchyRun() {
  return useMutation({
    mutationFn: ({ projectId, params }: { projectId: string; params: HierarchyRunParameters }) =>
      startHierarchyRun(projectId, params),
  });
}
