import type { ReductionNotion, ReductionSort, ReviewState } from "@shared/schemas/reductions";

export interface ReductionFilter {
  state?: ReviewState;
  notion?: ReductionNotion;
  sourceModelId?: string;
  flag?: "none" | "constant" | "identity" | "decoupled" | "trivial" | "isomorphic";
  minTargetNodes?: number;
  maxTargetNodes?: number;
  runId?: string;
  sort?: ReductionSort;
}

export const reductionKeys = {
  all: ["reductions"] as const,
  project: (projectId: string) => [...reductionKeys.all, projectId] as const,
  list: (projectId: string, f: ReductionFilter) => [...reductionKeys.project(projectId), "list", f] as const,
  detail: (projectId: string, reductionId: string) =>
    [...reductionKeys.project(projectId), "detail", reductionId] as const,
  hierarchy: (projectId: string) => [...reductionKeys.project(projectId), "hierarchy"] as const,
};

export const reductionsPath = (projectId: string) => `/projects/${projectId}/reductions`;
export const reductionPath = (projectId: string, reductionId: string) => `${reductionsPath(projectId)}/${reductionId}`;
