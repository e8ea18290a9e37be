import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import type { Run } from "@shared/schemas/runs";
import { apiRequest } from "@/lib/api-client";
import { runPath } from "./keys";
import { forgetRun } from "./run-cache";

export const deleteRun = (run: Pick<Run, "id" | "projectId">) =>
  apiRequest(runPath(run.projectId, run.id), z.unknown(), { method: "DELETE" });

export function useDeleteRun() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteRun, onSuccess: (_answer, run) => forgetRun(qc, run) });
}
