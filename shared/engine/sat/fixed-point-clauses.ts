// Fixed points x = F(x) as clauses over one variable per node: for each cube of a cover of f_i = 1 the clause
// "cube -> x_i", for each cube of f_i = 0 the clause "cube -> not x_i". Together they say x_i <-> f_i(x) exactly,
// with no auxiliary variables (the covers are those of table-cubes.ts), which keeps MiniSat's work small on
// networks of thousands of nodes.
import { CancelledError } from "../errors";
import type { BooleanNetwork } from "../network";
import type { ShouldStop } from "../progress";
import { ClauseSolver } from "./clause-solver";
import { tableCubes } from "./table-cubes";

/** Require output <-> table(inputs), where row bit j of the table is the value of variable inputs[j]. */
export function requireNodeFunction(
  solver: ClauseSolver,
  table: Uint8Array,
  inputs: ArrayLike<number>,
  output: number,
): void {
  for (const value of [0, 1] as const) {
    for (const cube of tableCubes(table, inputs.length, value)) {
      const clause = [value === 1 ? output : -output];
      for (let j = 0; j < inputs.length; j++)
        if (cube.mask & (1 << j)) clause.push((cube.value >> j) & 1 ? -inputs[j]! : inputs[j]!);
      solver.clause(clause);
    }
  }
}

/** Require state variables vars[i] (one per node) to form a fixed point of `net`. */
export function requireFixedPoint(solver: ClauseSolver, net: BooleanNetwork, vars: ArrayLike<number>): void {
  for (let i = 0; i < net.names.length; i++)
    requireNodeFunction(
      solver,
      net.tables[i]!,
      Array.from(net.regulators[i]!, (r) => vars[r]!),
      vars[i]!,
    );
}

/**
 * Visit every fixed point (one 0/1 byte per node) until `limit` have been visited. Returns true when the list is
 * complete, false when another fixed point exists beyond the limit.
 */
export function forEachFixedPoint(
  net: BooleanNetwork,
  limit: number,
  visit: (state: Uint8Array) => void,
  shouldStop?: ShouldStop,
): boolean {
  const n = net.names.length;
  const solver = new ClauseSolver();
  const vars = Int32Array.from({ length: n }, () => solver.newVar());
  requireFixedPoint(solver, net, vars);
  for (let count = 0; ; count++) {
    if (shouldStop?.()) throw new CancelledError();
    const solution = solver.solve();
    if (!solution) return true;
    if (count >= limit) return false;
    const state = Uint8Array.from(vars, (v) => (solution[v] ? 1 : 0));
    visit(state);
    solver.clause(Array.from(vars, (v, i) => (state[i] ? -v : v)));
  }
}
