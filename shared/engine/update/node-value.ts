// One-state-at-a-time evaluation of node functions on a state held as one byte per node, for networks of
// any size (the word-parallel tables in successor-table.ts cover only up to 24 nodes).
import type { BooleanNetwork } from "../network";

/** Value of node i's function on `state` (one 0/1 byte per node). */
export function nodeValue(net: BooleanNetwork, node: number, state: Uint8Array): number {
  const regs = net.regulators[node]!;
  let row = 0;
  for (let j = 0; j < regs.length; j++) row |= state[regs[j]!]! << j;
  return net.tables[node]![row]!;
}

/** Synchronous successor of `state`, written into `out` (which must not be `state`). Returns `out`. */
export function synchronousStep(
  net: BooleanNetwork,
  state: Uint8Array,
  out: Uint8Array = new Uint8Array(state.length),
): Uint8Array {
  for (let i = 0; i < state.length; i++) out[i] = nodeValue(net, i, state);
  return out;
}

/** Read a node-ordered 0/1 string into one byte per node. */
export function bytesFromString(text: string): Uint8Array {
  const out = new Uint8Array(text.length);
  for (let i = 0; i < text.length; i++) out[i] = text.charCodeAt(i) === 49 ? 1 : 0;
  return out;
}

/** Write one byte per node as a node-ordered 0/1 string. */
export function bytesToString(state: Uint8Array): string {
  let s = "";
  for (let i = 0; i < state.length; i++) s += state[i] ? "1" : "0";
  return s;
}
