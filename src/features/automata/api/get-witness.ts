import { queryOptions, useQuery } from "@tanstack/react-query";
import { WitnessReport, type HierarchyParameters } from "@shared/schemas/automata";
import { apiRequest } from "@/lib/api-client";
import { automataKeys, parameterQuery } from "./keys";

export const getWitness = (source: number, target: number, p: HierarchyParameters) =>
  apiRequest(`/automata/witness?source=${source}&target=${target}&${parameterQuery(p)}`, WitnessReport);

export const witnessQuery = (source: number, target: number, p: HierarchyParameters) =>
  queryOptions({
    queryKey: automataKeys.witness(source, target, p),
    queryFn: () => getWitness(source, target, p),
    staleTime: Infinity,
  });

export function useWitness(source: number, target: number | null, p: HierarchyParameters) {
  return useQuery({ ...witnessQuery(source, target ?? -1, p), enabled: target !== null });
}
