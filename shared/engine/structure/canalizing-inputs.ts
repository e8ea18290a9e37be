// Canalizing inputs: an input that, at one of its values, fixes the node's output whatever the other inputs are
// (Kauffman, "The large scale structure and dynamics of gene control circuits: an ensemble approach",
// J. Theor. Biol. 1974). Only essential inputs are reported, since a fictitious input canalizes only trivially.
import type { BooleanNetwork } from "../network";
import { regulatorSign } from "./interaction-graph";

export interface CanalizingInput {
  node: number;
  /** Position in the node's regulator list, and the regulating node. */
  position: number;
  regulator: number;
  inputValue: 0 | 1;
  output: 0 | 1;
}

export function canalizingInputs(net: BooleanNetwork): CanalizingInput[] {
  const found: CanalizingInput[] = [];
  net.tables.forEach((table, node) => {
    const regs = net.regulators[node]!;
    for (let j = 0; j < regs.length; j++) {
      if (regulatorSign(regs, table, regs[j]!) === "non-essential") continue;
      for (const a of [0, 1] as const) {
        let seen = -1;
        let constant = true;
        for (let row = 0; row < table.length && constant; row++) {
          if (((row >> j) & 1) !== a) continue;
          if (seen === -1) seen = table[row]!;
          else if (table[row] !== seen) constant = false;
        }
        if (constant && seen !== -1)
          found.push({ node, position: j, regulator: regs[j]!, inputValue: a, output: seen as 0 | 1 });
      }
    }
  });
  return found;
}
