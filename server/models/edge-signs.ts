// Interaction graph of a compiled network with the sign of every edge read off the truth tables: an input is
// positive when raising it never lowers the output, negative when it never raises it, dual when both happen, and
// non-essential when it never matters (the usual definition, e.g. Remy, Ruet, Thieffry, "Graphic requirements for
// multistability and attractive cycles in a Boolean dynamical framework", Adv. Appl. Math. 2008).
import type { BooleanNetwork } from "../../shared/engine/network";
import type { EdgeSign } from "../../shared/schemas/models";

export function edgeSign(table: Uint8Array, input: number): EdgeSign {
  let rises = false;
  let falls = false;
  const bit = 1 << input;
  for (let row = 0; row < table.length; row++) {
    if (row & bit) continue;
    const low = table[row]!;
    const high = table[row | bit]!;
    if (high > low) rises = true;
    else if (high < low) falls = true;
  }
  if (rises && falls) return "dual";
  if (rises) return "positive";
  if (falls) return "negative";
  return "non-essential";
}

export interface SignedEdge { source: string; target: string; sign: EdgeSign }

export function signedEdges(net: BooleanNetwork): SignedEdge[] {
  const edges: SignedEdge[] = [];
  net.names.forEach((target, i) => {
    Array.from(net.regulators[i]!).forEach((r, j) => {
      edges.push({ source: net.names[r]!, target, sign: edgeSign(net.tables[i]!, j) });
    });
  });
  return edges;
}
