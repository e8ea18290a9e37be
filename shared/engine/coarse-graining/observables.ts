// Observables for coarse-graining: Boolean functions of chosen source nodes, together defining the projection
// p: {0,1}^n -> {0,1}^m (Israeli, Goldenfeld, "Coarse-graining of cellular automata, emergence, and the
// predictability of complex systems", Physical Review E, 2006, for the projection view).
import { EngineError } from "../errors";
import type { BooleanNetwork } from "../network";

export interface Observable {
  readonly name: string;
  /** Source node indices read by the observable; table row bit j = value of inputs[j]. */
  readonly inputs: readonly number[];
  readonly table: Uint8Array;
}

/** The observable that reads one source node. */
export function nodeObservable(source: BooleanNetwork, node: number): Observable {
  if (!(node >= 0 && node < source.names.length))
    throw new EngineError("BAD_OBSERVABLE", `node ${node} is not a source node`);
  return { name: source.names[node]!, inputs: [node], table: Uint8Array.of(0, 1) };
}

/** p(x) for every source state x (bit k of the label = observable k). */
export function observeAll(n: number, observables: readonly Observable[]): Uint32Array {
  if (observables.length > 16) throw new EngineError("TOO_LARGE", "at most 16 observables are supported");
  const labels = new Uint32Array(2 ** n);
  observables.forEach((o, k) => {
    if (o.table.length !== 1 << o.inputs.length)
      throw new EngineError("BAD_OBSERVABLE", `observable "${o.name}" has a table of the wrong size`);
    for (const v of o.inputs)
      if (!(v >= 0 && v < n))
        throw new EngineError("BAD_OBSERVABLE", `observable "${o.name}" reads a node out of range`);
    for (let x = 0; x < labels.length; x++) {
      let row = 0;
      for (let j = 0; j < o.inputs.length; j++) row |= ((x >>> o.inputs[j]!) & 1) << j;
      if (o.table[row]) labels[x] = labels[x]! | (1 << k);
    }
  });
  return labels;
}
