import { useMutation } from "@tanstack/react-query";
import { TrajectoryResult, type TrajectoryBody } from "@shared/schemas/models";
import { apiRequest } from "@/lib/api-client";
import { revisionPath } from "./keys";

export const getTrajectory = (projectId: string, modelId: string, revision: number, body: TrajectoryBody) =>
  apiRequest(`${revisionPath(projectId, modelId, revision)}/trajectory`, TrajectoryResult, { method: "POST", body });

export function useTrajectory(projectId: string, modelId: string, revision: number) {
  return useMutation({ mutationFn: (body: TrajectoryBody) => getTrajectory(projectId, modelId, revision, body) });
}
