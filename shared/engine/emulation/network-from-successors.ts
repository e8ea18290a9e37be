// Writing a map on {0,1}^m (a successor table) as a Boolean network with only essential regulators, the
// standard reading of a synchronous network as a map (Kauffman, J. Theor. Biol., 1969).
import { EngineError } from "../errors";
import { checkNetwork, type BooleanNetwork } from "../network";

/** Build the network whose synchronous map is `succ` (length 2^m); node i keeps only the inputs it depends on. */
export function networkFromSuccessors(names: readonly string[], succ: ArrayLike<number>): BooleanNetwork {
  const m = names.length;
  if (succ.length !== 2 ** m)
    throw new EngineError("BAD_MAP", `a map on ${m} nodes needs ${2 ** m} successors, got ${succ.length}`);
  const regulators: Int32Array[] = [];
  const tables: Uint8Array[] = [];
  for (let i = 0; i < m; i++) {
    const regs: number[] = [];
    for (let j = 0; j < m; j++) {
      let essential = false;
      for (let x = 0; x < succ.length && !essential; x++) {
        if (((succ[x]! >>> i) & 1) !== ((succ[x ^ (1 << j)]! >>> i) & 1)) essential = true;
      }
      if (essential) regs.push(j);
    }
    const table = new Uint8Array(1 << regs.length);
    for (let row = 0; row < table.length; row++) {
      let x = 0;
      for (let r = 0; r < regs.length; r++) if ((row >> r) & 1) x |= 1 << regs[r]!;
      table[row] = (succ[x]! >>> i) & 1;
    }
    regulators.push(Int32Array.from(regs));
    tables.push(table);
  }
  return checkNetwork({ names: [...names], regulators, tables });
}

/** The successor table of a network with at most 22 nodes, state by state (small targets only). */
export function successorsOfNetwork(net: BooleanNetwork): Uint32Array {
  const m = net.names.length;
  if (m > 22) throw new EngineError("TOO_LARGE", `a target of ${m} nodes is too large to tabulate`);
  const out = new Uint32Array(2 ** m);
  for (let x = 0; x < out.length; x++) {
    let y = 0;
    for (let i = 0; i < m; i++) {
      const regs = net.regulators[i]!;
      let row = 0;
      for (let j = 0; j < regs.length; j++) row |= ((x >>> regs[j]!) & 1) << j;
      y |= net.tables[i]![row]! << i;
    }
    out[x] = y >>> 0;
  }
  return out;
}
