// Synchronous stepping of a compiled network, for the reductions engine: whole transition tables of F^t on
// small state spaces and value-vector stepping for large networks (synchronous update, as in Kauffman,
// "Metabolic stability and epigenesis in randomly constructed genetic nets", J. Theor. Biol., 1969).
import { EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import { successorTable as updateSuccessorTable } from "../update";

/** Largest node count whose whole state space the reductions engine tabulates. */
export const MAX_TABULATED_NODES = 22;

/** One synchronous step on a vector of node values (one byte per node); writes into `out`. */
export function stepValues(net: BooleanNetwork, values: Uint8Array, out: Uint8Array): Uint8Array {
  const n = net.names.length;
  for (let i = 0; i < n; i++) {
    const regs = net.regulators[i]!;
    let row = 0;
    for (let j = 0; j < regs.length; j++) row |= values[regs[j]!]! << j;
    out[i] = net.tables[i]![row]!;
  }
  return out;
}

/** t synchronous steps on a value vector; returns a new vector. */
export function iterateValues(net: BooleanNetwork, values: Uint8Array, t: number): Uint8Array {
  let cur = Uint8Array.from(values);
  let next = new Uint8Array(cur.length);
  for (let s = 0; s < t; s++) {
    stepValues(net, cur, next);
    [cur, next] = [next, cur];
  }
  return cur;
}

/**
 * The successor of every state under one synchronous step (state index bit i = node i). Delegates to the
 * word-parallel table of the update layer, so every reduction search shares the one fast implementation;
 * the reductions engine keeps its own lower size limit because it holds several tables of F^t at once.
 */
export function successorTable(net: BooleanNetwork): Uint32Array {
  const n = net.names.length;
  if (n > MAX_TABULATED_NODES) {
    throw new EngineError(
      "TOO_LARGE",
      `a state space of ${n} nodes is too large to tabulate (at most ${MAX_TABULATED_NODES})`,
    );
  }
  return updateSuccessorTable(net);
}

/** The successor table of F^t, by repeated composition of the one-step table. */
export function powerTable(step: Uint32Array, t: number): Uint32Array {
  if (t < 1) throw new EngineError("BAD_TIME", `the time scale must be at least 1 (got ${t})`);
  const out = Uint32Array.from(step);
  for (let s = 1; s < t; s++) for (let x = 0; x < out.length; x++) out[x] = step[out[x]!]!;
  return out;
}

/** Convenience: the successor table of F^t straight from the network. */
export function transitionTable(net: BooleanNetwork, t: number): Uint32Array {
  return powerTable(successorTable(net), t);
}
