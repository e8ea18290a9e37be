// The interaction (regulatory) graph read off the functions: regulator r acts on node i positively if raising r
// can raise i, negatively if it can lower it, dually if both, and is non-essential (fictitious) if never; the
// edge-sign convention of Thomas and d'Ari, "Biological Feedback", CRC Press 1990.
import type { BooleanNetwork } from "../network";

export type EdgeSign = "positive" | "negative" | "dual" | "non-essential";

export interface InteractionEdge {
  source: number;
  target: number;
  sign: EdgeSign;
}

export interface InteractionGraph {
  /** One edge per distinct (source, target) pair listed in the regulators, non-essential ones included. */
  edges: InteractionEdge[];
  /** Essential regulators per node. */
  inDegree: Int32Array;
  /** Essential targets per node. */
  outDegree: Int32Array;
}

/** Sign of regulator `source` on a node with the given regulators and table; repeated listings flip together. */
export function regulatorSign(regulators: Int32Array, table: Uint8Array, source: number): EdgeSign {
  let mask = 0;
  for (let j = 0; j < regulators.length; j++) if (regulators[j] === source) mask |= 1 << j;
  let up = false;
  let down = false;
  for (let row = 0; row < table.length; row++) {
    if ((row & mask) !== 0) continue;
    const low = table[row]!;
    const high = table[row | mask]!;
    if (high > low) up = true;
    else if (high < low) down = true;
  }
  return up && down ? "dual" : up ? "positive" : down ? "negative" : "non-essential";
}

export function interactionGraph(net: BooleanNetwork): InteractionGraph {
  const n = net.names.length;
  const edges: InteractionEdge[] = [];
  const inDegree = new Int32Array(n);
  const outDegree = new Int32Array(n);
  for (let target = 0; target < n; target++) {
    const regs = net.regulators[target]!;
    for (const source of new Set(regs)) {
      const sign = regulatorSign(regs, net.tables[target]!, source);
      edges.push({ source, target, sign });
      if (sign !== "non-essential") {
        inDegree[target]!++;
        outDegree[source]!++;
      }
    }
  }
  return { edges, inDegree, outDegree };
}
