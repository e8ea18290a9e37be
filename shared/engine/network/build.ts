// Small constructors and conversions around the compiled network, so callers never hand-assemble typed arrays.
import { EngineError } from "../errors";
import type { BooleanNetwork } from "./types";

/** Build a network from per-node regulator lists and a function of the regulator values. */
export function networkFromFunctions(
  names: readonly string[],
  regulators: readonly (readonly number[])[],
  fn: (node: number, inputs: readonly number[]) => number,
): BooleanNetwork {
  const tables = regulators.map((regs, node) => {
    const k = regs.length;
    const table = new Uint8Array(1 << k);
    const inputs = new Array<number>(k).fill(0);
    for (let row = 0; row < table.length; row++) {
      for (let j = 0; j < k; j++) inputs[j] = (row >> j) & 1;
      table[row] = fn(node, inputs) ? 1 : 0;
    }
    return table;
  });
  return checkNetwork({ names: [...names], regulators: regulators.map((r) => Int32Array.from(r)), tables });
}

/** Check what the types cannot say: table sizes, regulator ranges, distinct names. Returns the network. */
export function checkNetwork(net: BooleanNetwork): BooleanNetwork {
  const n = net.names.length;
  if (net.regulators.length !== n || net.tables.length !== n) {
    throw new EngineError("BAD_NETWORK", "names, regulators and tables must have one entry per node");
  }
  const seen = new Set<string>();
  for (let i = 0; i < n; i++) {
    const name = net.names[i]!;
    if (seen.has(name)) throw new EngineError("BAD_NETWORK", `node name "${name}" appears twice`);
    seen.add(name);
    const regs = net.regulators[i]!;
    if (regs.length > 20)
      throw new EngineError("BAD_NETWORK", `node "${name}" has ${regs.length} regulators; at most 20 are supported`);
    if (net.tables[i]!.length !== 1 << regs.length) {
      throw new EngineError(
        "BAD_NETWORK",
        `node "${name}" has ${regs.length} regulators but a table of ${net.tables[i]!.length} rows`,
      );
    }
    for (const r of regs)
      if (r < 0 || r >= n)
        throw new EngineError("BAD_NETWORK", `node "${name}" has a regulator index ${r} out of range`);
  }
  return net;
}

/** Write a state index as a 0/1 string in node order. */
export function stateToString(state: number, nodeCount: number): string {
  let s = "";
  for (let i = 0; i < nodeCount; i++) s += (Math.floor(state / 2 ** i) % 2).toString();
  return s;
}

/** Read a 0/1 string in node order back into a state index. */
export function stateFromString(text: string): number {
  let state = 0;
  for (let i = text.length - 1; i >= 0; i--) {
    const c = text[i];
    if (c !== "0" && c !== "1")
      throw new EngineError("BAD_STATE", `state "${text}" has a character other than 0 or 1 at position ${i + 1}`);
    state = state * 2 + (c === "1" ? 1 : 0);
  }
  return state;
}
