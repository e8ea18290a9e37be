// Subspaces of the state space: some nodes fixed, the others free, held as one Int8Array entry per node (-1 free,
// 0 or 1 fixed). Percolation fixes every free node whose function is constant on the current subspace until none
// is left; on a trap space the result is again a trap space, and every minimal trap space inside it fixes all
// percolated nodes (Klarner, Bockmayr, Siebert, "Computing maximal and minimal trap spaces of Boolean networks",
// Natural Computing 2015, use the same closure). Restriction writes a subspace's free part as a network of its own.
import { EngineError } from "../errors";
import { checkNetwork, type BooleanNetwork } from "../network";

export const FREE = -1;

/** The value node `node`'s function takes on every state of the subspace, or FREE when it is not constant there. */
export function constantOnSubspace(net: BooleanNetwork, node: number, subspace: Int8Array): number {
  const regs = net.regulators[node]!;
  const table = net.tables[node]!;
  let base = 0;
  let freeMask = 0;
  for (let j = 0; j < regs.length; j++) {
    const v = subspace[regs[j]!]!;
    if (v === FREE) freeMask |= 1 << j;
    else if (v === 1) base |= 1 << j;
  }
  const first = table[base]!;
  // Enumerate the rows of the subspace as the subsets of the free positions.
  for (let sub = freeMask; sub !== 0; sub = (sub - 1) & freeMask) if (table[base | sub] !== first) return FREE;
  return first;
}

/**
 * Close a subspace under percolation: fix each free node whose function is constant on the current subspace, until
 * none is. Nodes fixed in `start` stay as they are (the caller decides whether they are constants, perturbations or
 * the fixed part of a trap space). Returns a new array.
 */
export function percolate(net: BooleanNetwork, start?: Int8Array): Int8Array {
  const n = net.names.length;
  const subspace = start ? Int8Array.from(start) : new Int8Array(n).fill(FREE);
  if (subspace.length !== n) throw new EngineError("BAD_SUBSPACE", `a subspace needs ${n} entries`);
  const readers = readersOf(net);
  const queued = new Uint8Array(n);
  const queue: number[] = [];
  for (let i = n - 1; i >= 0; i--) if (subspace[i] === FREE) (queue.push(i), (queued[i] = 1));
  while (queue.length > 0) {
    const i = queue.pop()!;
    queued[i] = 0;
    if (subspace[i] !== FREE) continue;
    const c = constantOnSubspace(net, i, subspace);
    if (c === FREE) continue;
    subspace[i] = c;
    for (const r of readers[i]!) if (subspace[r] === FREE && !queued[r]) (queue.push(r), (queued[r] = 1));
  }
  return subspace;
}

/** For each node, the nodes whose functions read it. */
export function readersOf(net: BooleanNetwork): Int32Array[] {
  const n = net.names.length;
  const lists: number[][] = Array.from({ length: n }, () => []);
  for (let i = 0; i < n; i++) for (const r of new Set(net.regulators[i]!)) lists[r]!.push(i);
  return lists.map((l) => Int32Array.from(l));
}

/** A truth table over `regs` with the inputs it does not depend on removed (row bit j = kept input j). */
export function essentialPart(regs: readonly number[], table: Uint8Array): { regulators: number[]; table: Uint8Array } {
  let current = table;
  let kept = [...regs];
  for (let j = kept.length - 1; j >= 0; j--) {
    const bit = 1 << j;
    let depends = false;
    for (let r = 0; r < current.length && !depends; r++)
      if (!(r & bit) && current[r] !== current[r | bit]) depends = true;
    if (depends) continue;
    const smaller = new Uint8Array(current.length >> 1);
    for (let r = 0; r < smaller.length; r++) smaller[r] = current[((r >> j) << (j + 1)) | (r & (bit - 1))]!;
    current = smaller;
    kept = [...kept.slice(0, j), ...kept.slice(j + 1)];
  }
  return { regulators: kept, table: current };
}

export interface RestrictedNetwork {
  /** The free nodes with their functions restricted to the subspace, reading only free nodes they depend on. */
  readonly network: BooleanNetwork;
  /** nodes[i] is the index in the original network of restricted node i. */
  readonly nodes: Int32Array;
}

/** The free part of a subspace as a network of its own (node names and order kept). */
export function restrictToSubspace(net: BooleanNetwork, subspace: Int8Array): RestrictedNetwork {
  const n = net.names.length;
  const position = new Int32Array(n).fill(-1);
  const nodes: number[] = [];
  for (let i = 0; i < n; i++) if (subspace[i] === FREE) ((position[i] = nodes.length), nodes.push(i));
  const regulators: Int32Array[] = [];
  const tables: Uint8Array[] = [];
  for (const i of nodes) {
    const regs = net.regulators[i]!;
    const table = net.tables[i]!;
    const freePositions: number[] = [];
    let base = 0;
    for (let j = 0; j < regs.length; j++) {
      const v = subspace[regs[j]!]!;
      if (v === FREE) freePositions.push(j);
      else if (v === 1) base |= 1 << j;
    }
    const restricted = new Uint8Array(1 << freePositions.length);
    for (let row = 0; row < restricted.length; row++) {
      let full = base;
      for (let q = 0; q < freePositions.length; q++) if ((row >> q) & 1) full |= 1 << freePositions[q]!;
      restricted[row] = table[full]!;
    }
    const part = essentialPart(
      freePositions.map((j) => position[regs[j]!]!),
      restricted,
    );
    regulators.push(Int32Array.from(part.regulators));
    tables.push(part.table);
  }
  return {
    network: checkNetwork({ names: nodes.map((i) => net.names[i]!), regulators, tables }),
    nodes: Int32Array.from(nodes),
  };
}

/** The subspace as text: one character per node, '0', '1' or '-' for free. */
export function subspacePattern(subspace: Int8Array): string {
  let s = "";
  for (let i = 0; i < subspace.length; i++) s += subspace[i] === FREE ? "-" : subspace[i] === 1 ? "1" : "0";
  return s;
}

/** The fixed nodes of a subspace by name. */
export function fixedByName(net: BooleanNetwork, subspace: Int8Array): Record<string, 0 | 1> {
  const out: [string, 0 | 1][] = [];
  for (let i = 0; i < subspace.length; i++)
    if (subspace[i] !== FREE) out.push([net.names[i]!, subspace[i] === 1 ? 1 : 0]);
  // fromEntries keeps a node named "__proto__" as an own property, which assignment would not.
  return Object.fromEntries(out);
}
