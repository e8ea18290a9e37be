// The address of the model under one perturbation: the perturbation, the phenotype it is read against and the
// screen it came from travel as query parameters, so the view can be bookmarked, shared and reloaded.
import type { Assignment } from "@shared/engine/expectations";

const compact = (a: Readonly<Record<string, 0 | 1>>) =>
  Object.entries(a)
    .map(([n, v]) => `${n}=${v}`)
    .join(",");

export function perturbedViewPath(
  projectId: string,
  modelId: string,
  revision: number,
  perturbation: Readonly<Record<string, 0 | 1>>,
  phenotype: Assignment,
  screenRunId: string | null,
): string {
  const q = new URLSearchParams({ revision: String(revision), perturbation: compact(perturbation) });
  if (Object.keys(phenotype).length > 0) q.set("phenotype", compact(phenotype));
  if (screenRunId) q.set("screen", screenRunId);
  return `/projects/${projectId}/models/${modelId}/perturbed?${q.toString()}`;
}
