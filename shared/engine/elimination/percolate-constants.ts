// Percolation of constants and fixed inputs as a reduction: nodes with constant functions (and any nodes the caller
// holds at a value, such as inputs) are fixed, every node whose function becomes constant is fixed in turn, and the
// fixed nodes are removed with their values substituted. Every attractor, synchronous or asynchronous, fixes the
// percolated nodes (a constant node keeps its value once updated), and on that subspace the dynamics is that of the
// reduced network, so attractors and fixed points correspond one to one (the percolation step of Klarner, Bockmayr,
// Siebert, Natural Computing 2015, and of Naldi et al., TCS 2011).
import { EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import { FREE, percolate, restrictToSubspace } from "../trap-spaces";

/** Largest network accepted by percolation. */
export const MAX_PERCOLATION_NODES = 100_000;

export interface PercolationResult {
  /** The free nodes, in their original order, with the fixed values substituted. */
  readonly network: BooleanNetwork;
  /** Fixed nodes in node order, with their values (held nodes included). */
  readonly fixed: Record<string, 0 | 1>;
  readonly eliminated: string[];
  readonly preserves: string;
}

/** Percolate the constants of `net`, with the nodes in `hold` kept at the given values (their rules replaced). */
export function percolateConstants(net: BooleanNetwork, hold: Record<string, 0 | 1> = {}): PercolationResult {
  const n = net.names.length;
  if (n > MAX_PERCOLATION_NODES)
    throw new EngineError(
      "TOO_LARGE",
      `percolation supports at most ${MAX_PERCOLATION_NODES} nodes; this network has ${n}`,
    );
  const start = new Int8Array(n).fill(FREE);
  const index = new Map(net.names.map((name, i) => [name, i] as const));
  for (const [name, value] of Object.entries(hold)) {
    const i = index.get(name);
    if (i === undefined) throw new EngineError("UNKNOWN_NODE", `there is no node named "${name}"`);
    if (value !== 0 && value !== 1) throw new EngineError("BAD_ARGUMENT", `node "${name}" can be held at 0 or 1 only`);
    start[i] = value;
  }
  const subspace = percolate(net, start);
  const fixedPairs: [string, 0 | 1][] = [];
  const eliminated: string[] = [];
  for (let i = 0; i < n; i++) {
    if (subspace[i] === FREE) continue;
    fixedPairs.push([net.names[i]!, subspace[i] === 1 ? 1 : 0]);
    eliminated.push(net.names[i]!);
  }
  // fromEntries keeps a node named "__proto__" as an own property, which assignment would not.
  const fixed: Record<string, 0 | 1> = Object.fromEntries(fixedPairs);
  const held = Object.keys(hold).length;
  const preserves =
    (held > 0 ? `For the model with ${Object.keys(hold).join(", ")} held fixed: ` : "") +
    "all attractors, synchronous and asynchronous, and all fixed points, one to one: each attractor keeps the " +
    "percolated nodes at their listed values and moves on the remaining nodes exactly as the reduced model does.";
  return { network: restrictToSubspace(net, subspace).network, fixed, eliminated, preserves };
}
