// The states of one attractor as a grid: its cycle in order, oscillating nodes marked, markers first.
import type { SynchronousResult } from "@shared/schemas/models";
import { StateGrid } from "@/components/state-grid/state-grid";
import { oscillatingNodes } from "@/components/state-grid/grid-layout";

export function attractorName(result: Pick<SynchronousResult, "attractors">, index: number): string {
  const a = result.attractors[index];
  if (!a) return `attractor ${index + 1}`;
  const kind = a.length === 1 ? "fixed point" : `cycle of ${a.length}`;
  return `attractor ${index + 1} (${kind}${a.phenotype ? `, phenotype ${a.phenotype}` : ""})`;
}

export function AttractorStates({
  result,
  index,
  inputs,
  fileName,
}: {
  result: SynchronousResult;
  index: number;
  inputs: readonly string[];
  fileName: string;
}) {
  const a = result.attractors[index];
  if (!a) return null;
  const name = attractorName(result, index);
  return (
    <div className="space-y-1" data-testid="attractor-states">
      <h4 className="text-xs font-semibold uppercase tracking-wide text-slate-600">States of {name}</h4>
      <StateGrid
        nodes={result.nodes}
        rows={a.states.map((state, j) => ({ label: a.length === 1 ? "state" : `step ${j}`, state }))}
        markers={result.markers}
        inputs={inputs}
        oscillating={oscillatingNodes(a.states)}
        fileName={`${fileName}-attractor-${index + 1}`}
        caption={`The ${a.states.length === 1 ? "state" : `${a.states.length} states in cycle order`} of ${name}.`}
        testId="attractor-grid"
      />
    </div>
  );
}
