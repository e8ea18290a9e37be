import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ReductionDetail, type CommentBody } from "@shared/schemas/reductions";
import { apiRequest } from "@/lib/api-client";
import { reductionKeys, reductionPath } from "./keys";

export const addComment = (projectId: string, reductionId: string, body: CommentBody) =>
  apiRequest(`${reductionPath(projectId, reductionId)}/comments`, ReductionDetail, { method: "POST", body });

export function useAddComment(projectId: string, reductionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CommentBody) => addComment(projectId, reductionId, body),
    onSuccess: (data) => qc.setQueryData(reductionKeys.detail(projectId, reductionId), data),
  });
}
