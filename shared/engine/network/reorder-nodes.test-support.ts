// Tests of invariance under relabelling: the same network with its nodes renamed and listed in another order.
import { checkNetwork } from "./build";
import type { BooleanNetwork } from "./types";

/** Prefixes every name and lists the nodes in the order `perm` (new node i is old node perm[i]). */
export function reorderNodes(net: BooleanNetwork, perm: readonly number[], prefix: string): BooleanNetwork {
  const inv = new Array<number>(perm.length);
  perm.forEach((old, i) => (inv[old] = i));
  return checkNetwork({
    names: perm.map((old) => `${prefix}${net.names[old]}`),
    regulators: perm.map((old) => Int32Array.from(net.regulators[old]!, (r) => inv[r]!)),
    tables: perm.map((old) => net.tables[old]!),
  });
}
