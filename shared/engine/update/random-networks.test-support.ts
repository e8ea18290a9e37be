// Test-only helpers shared by the dynamics tests: a small Kauffman NK generator (Kauffman, "Metabolic stability
// and epigenesis in randomly constructed genetic nets", J. Theor. Biol. 1969) and plainly correct references.
import seedrandom from "seedrandom";
import { networkFromFunctions, type BooleanNetwork } from "../network";

/** N nodes, each with K distinct regulators drawn uniformly, each truth-table row 1 with probability p. */
export function randomNK(n: number, k: number, seed: number | string, p = 0.5): BooleanNetwork {
  const rng = seedrandom(String(seed));
  const regulators: number[][] = [];
  for (let i = 0; i < n; i++) {
    // Rejection keeps the draw uniform over distinct regulators without an O(n) pool per node.
    const regs: number[] = [];
    while (regs.length < Math.min(k, n)) {
      const r = Math.floor(rng() * n);
      if (!regs.includes(r)) regs.push(r);
    }
    regulators.push(regs);
  }
  const tables = regulators.map((r) => Array.from({ length: 1 << r.length }, () => (rng() < p ? 1 : 0)));
  return networkFromFunctions(
    Array.from({ length: n }, (_, i) => `g${i}`),
    regulators,
    (node, inputs) => tables[node]![inputs.reduce((row, v, j) => row | (v << j), 0)]!,
  );
}

/** Reference successor: evaluate every node's truth table one state at a time. */
export function slowSuccessor(net: BooleanNetwork, state: number): number {
  let next = 0;
  for (let i = 0; i < net.names.length; i++) {
    const regs = net.regulators[i]!;
    let row = 0;
    for (let j = 0; j < regs.length; j++) row += Math.floor(state / 2 ** regs[j]!) % 2 === 1 ? 2 ** j : 0;
    next += net.tables[i]![row]! * 2 ** i;
  }
  return next;
}

/** Node-ordered 0/1 text of a state index. */
export function text(state: number, n: number): string {
  let s = "";
  for (let i = 0; i < n; i++) s += (Math.floor(state / 2 ** i) % 2).toString();
  return s;
}
