// The budding-yeast cell-cycle threshold network of Li, Long, Lu, Ouyang and Tang, "The yeast cell-cycle network
// is robustly designed", PNAS 2004 (Fig. 1), rebuilt here FROM MEMORY (edge list and signs are our recollection of
// the figure): S_i(t+1) = 1 if sum_j a_ij S_j(t) > 0, 0 if < 0, and on a tie S_i(t) is kept, except for the
// self-degrading nodes (Cln3, Cln1,2, Swi5, Cdc20&Cdc14, Mcm1/SFF), which fall to 0; all weights are +1 or -1.
import { networkFromFunctions, type BooleanNetwork } from "../network";

export const YEAST_NAMES = [
  "Cln3",
  "MBF",
  "SBF",
  "Cln12",
  "Cdh1",
  "Swi5",
  "Cdc20_14",
  "Clb56",
  "Sic1",
  "Clb12",
  "Mcm1_SFF",
];

const EDGES: [string, string, number][] = [
  ["Cln3", "MBF", 1],
  ["Cln3", "SBF", 1],
  ["SBF", "Cln12", 1],
  ["MBF", "Clb56", 1],
  ["Cln12", "Sic1", -1],
  ["Cln12", "Cdh1", -1],
  ["Clb56", "Sic1", -1],
  ["Clb56", "Cdh1", -1],
  ["Clb56", "Mcm1_SFF", 1],
  ["Clb56", "Clb12", 1],
  ["Clb12", "Mcm1_SFF", 1],
  ["Clb12", "Cdc20_14", 1],
  ["Clb12", "Sic1", -1],
  ["Clb12", "Cdh1", -1],
  ["Clb12", "SBF", -1],
  ["Clb12", "MBF", -1],
  ["Clb12", "Swi5", -1],
  ["Mcm1_SFF", "Clb12", 1],
  ["Mcm1_SFF", "Cdc20_14", 1],
  ["Mcm1_SFF", "Swi5", 1],
  ["Cdc20_14", "Swi5", 1],
  ["Cdc20_14", "Sic1", 1],
  ["Cdc20_14", "Cdh1", 1],
  ["Cdc20_14", "Clb56", -1],
  ["Cdc20_14", "Clb12", -1],
  ["Swi5", "Sic1", 1],
  ["Sic1", "Clb56", -1],
  ["Sic1", "Clb12", -1],
  ["Cdh1", "Clb12", -1],
];

const SELF_DEGRADING = new Set(["Cln3", "Cln12", "Swi5", "Cdc20_14", "Mcm1_SFF"]);

export function yeastCellCycle(): BooleanNetwork {
  const idx = new Map(YEAST_NAMES.map((name, i) => [name, i]));
  const regulators: number[][] = [];
  const weights: number[][] = [];
  YEAST_NAMES.forEach((name, i) => {
    // Position 0 is the node itself when it keeps its value on a tie.
    const regs = SELF_DEGRADING.has(name) ? [] : [i];
    const w = SELF_DEGRADING.has(name) ? [] : [0];
    for (const [from, to, weight] of EDGES) {
      if (to !== name) continue;
      regs.push(idx.get(from)!);
      w.push(weight);
    }
    regulators.push(regs);
    weights.push(w);
  });
  return networkFromFunctions(YEAST_NAMES, regulators, (node, x) => {
    const w = weights[node]!;
    let sum = 0;
    for (let j = 0; j < x.length; j++) sum += w[j]! * x[j]!;
    if (sum > 0) return 1;
    if (sum < 0) return 0;
    return SELF_DEGRADING.has(YEAST_NAMES[node]!) ? 0 : x[0]!;
  });
}
