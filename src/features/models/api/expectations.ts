// The model's expectations: the list, the expectation-by-revision matrix (polled while checks are going), and the
// changes (add, edit, remove, import, check), each invalidating the model's expectation queries.
import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import {
  CheckStarted,
  ExpectationList,
  ExpectationMatrix,
  ImportExpectationsResult,
  StoredExpectation,
  type ExpectationInput,
} from "@shared/schemas/expectations";
import { apiRequest } from "@/lib/api-client";
import { modelKeys, modelsPath } from "./keys";

export const expectationKeys = {
  all: (projectId: string, modelId: string) => [...modelKeys.model(projectId, modelId), "expectations"] as const,
  list: (projectId: string, modelId: string) => [...expectationKeys.all(projectId, modelId), "list"] as const,
  matrix: (projectId: string, modelId: string) => [...expectationKeys.all(projectId, modelId), "matrix"] as const,
};

export const expectationsPath = (projectId: string, modelId: string) =>
  `${modelsPath(projectId)}/${modelId}/expectations`;

export const expectationsExportUrl = (projectId: string, modelId: string) =>
  `/api${expectationsPath(projectId, modelId)}/export`;

export const expectationListQuery = (projectId: string, modelId: string) =>
  queryOptions({
    queryKey: expectationKeys.list(projectId, modelId),
    queryFn: () => apiRequest(expectationsPath(projectId, modelId), ExpectationList),
  });

export function useExpectations(projectId: string, modelId: string) {
  return useQuery(expectationListQuery(projectId, modelId));
}

export function useExpectationMatrix(projectId: string, modelId: string) {
  return useQuery({
    queryKey: expectationKeys.matrix(projectId, modelId),
    queryFn: () => apiRequest(`${expectationsPath(projectId, modelId)}/matrix`, ExpectationMatrix),
    // While a check is going the matrix fills in on its own.
    refetchInterval: (q) => ((q.state.data?.pendingRunIds.length ?? 0) > 0 ? 1500 : false),
  });
}

function useExpectationChange<V, R>(projectId: string, modelId: string, fn: (v: V) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSettled: () => qc.invalidateQueries({ queryKey: expectationKeys.all(projectId, modelId) }),
  });
}

export function useSaveExpectation(projectId: string, modelId: string) {
  return useExpectationChange(projectId, modelId, ({ rowId, body }: { rowId: string | null; body: ExpectationInput }) =>
    apiRequest(
      rowId ? `${expectationsPath(projectId, modelId)}/${rowId}` : expectationsPath(projectId, modelId),
      StoredExpectation,
      {
        method: rowId ? "PATCH" : "POST",
        body,
      },
    ),
  );
}

export function useDeleteExpectation(projectId: string, modelId: string) {
  return useExpectationChange(projectId, modelId, (rowId: string) =>
    apiRequest(`${expectationsPath(projectId, modelId)}/${rowId}`, z.unknown(), { method: "DELETE" }),
  );
}

export function useImportExpectations(projectId: string, modelId: string) {
  return useExpectationChange(projectId, modelId, (body: { csv: string; mode: "add" | "replace" }) =>
    apiRequest(`${expectationsPath(projectId, modelId)}/import`, ImportExpectationsResult, { method: "POST", body }),
  );
}

export function useCheckRevision(projectId: string, modelId: string) {
  return useExpectationChange(projectId, modelId, (revision: number) =>
    apiRequest(`${expectationsPath(projectId, modelId)}/check`, CheckStarted, { method: "POST", body: { revision } }),
  );
}
