// The synchronous analysis as the API shows it: attractors as text with basins, and each attractor labelled by the
// pattern of the chosen marker nodes (the phenotype reading of attractors in Kauffman, "Metabolic stability and
// epigenesis in randomly constructed genetic nets", J. Theor. Biol. 1969).
import type { BooleanNetwork } from "@shared/engine/network";
import { phenotypeLabel } from "@shared/engine/phenotype";
import { analyseSynchronous, attractorsAsText } from "@shared/engine/state-graph";
import type { AttractorRow, SynchronousResult } from "@shared/schemas/models";
import { HttpError } from "../../http/errors";

function markerIndices(nodes: readonly string[], markers: readonly string[]): number[] {
  return markers.map((m) => {
    const i = nodes.indexOf(m);
    if (i < 0) throw new HttpError(400, "UNKNOWN_NODE", `marker ${m} is not a node of the model`);
    return i;
  });
}

/** Attractors without phenotype labels: what the cache stores (labels are cheap to add per request). */
export function synchronousAttractors(net: BooleanNetwork): Omit<SynchronousResult, "markers"> {
  const analysis = analyseSynchronous(net);
  return {
    nodes: [...net.names],
    stateCount: analysis.stateCount,
    attractors: attractorsAsText(analysis).map((a) => ({ ...a, phenotype: null })),
    maxTransient: analysis.maxTransient,
    meanTransient: analysis.meanTransient,
  };
}

export function withPhenotypes(
  result: Omit<SynchronousResult, "markers">,
  markers: readonly string[],
): SynchronousResult {
  const indices = markerIndices(result.nodes, markers);
  const attractors: AttractorRow[] = result.attractors.map((a) => ({
    ...a,
    phenotype: markers.length ? phenotypeLabel(a.states, indices, result.nodes).pattern.join("") : null,
  }));
  return { ...result, attractors, markers: [...markers] };
}
