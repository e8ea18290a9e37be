// The mammalian cell-cycle model of Faure, Naldi, Chaouiya and Thieffry, "Dynamical analysis of a generic Boolean
// model for the control of the mammalian cell cycle", Bioinformatics 2006 (Table 1), transcribed from the project
// fixture tests/fixtures/sbml/faure-2006-cell-cycle.rules, whose rules were themselves written from memory.
import { networkFromFunctions, type BooleanNetwork } from "../network";

export const FAURE_NAMES = ["CycD", "Rb", "E2F", "CycE", "CycA", "p27", "Cdc20", "Cdh1", "UbcH10", "CycB"];

type V = Record<string, boolean>;
const RULES: [string[], (v: V) => boolean][] = [
  [["CycD"], (v) => v.CycD!],
  [
    ["CycD", "CycE", "CycA", "CycB", "p27"],
    (v) => (!v.CycD && !v.CycE && !v.CycA && !v.CycB) || (v.p27! && !v.CycD && !v.CycB),
  ],
  [["Rb", "CycA", "CycB", "p27"], (v) => (!v.Rb && !v.CycA && !v.CycB) || (v.p27! && !v.Rb && !v.CycB)],
  [["E2F", "Rb"], (v) => v.E2F! && !v.Rb],
  [
    ["E2F", "Rb", "Cdc20", "Cdh1", "UbcH10", "CycA"],
    (v) => (v.E2F! || v.CycA!) && !v.Rb && !v.Cdc20 && !(v.Cdh1 && v.UbcH10),
  ],
  [
    ["CycD", "CycE", "CycA", "CycB", "p27"],
    (v) => (!v.CycD && !v.CycE && !v.CycA && !v.CycB) || (v.p27! && !(v.CycE && v.CycA) && !v.CycB && !v.CycD),
  ],
  [["CycB"], (v) => v.CycB!],
  [["CycA", "CycB", "Cdc20", "p27"], (v) => (!v.CycA && !v.CycB) || v.Cdc20! || (v.p27! && !v.CycB)],
  [
    ["Cdh1", "UbcH10", "Cdc20", "CycA", "CycB"],
    (v) => !v.Cdh1 || (v.Cdh1! && v.UbcH10! && (v.Cdc20! || v.CycA! || v.CycB!)),
  ],
  [["Cdc20", "Cdh1"], (v) => !v.Cdc20 && !v.Cdh1],
];

export function faureCellCycle(): BooleanNetwork {
  const regulators = RULES.map(([regs]) => regs.map((name) => FAURE_NAMES.indexOf(name)));
  return networkFromFunctions(FAURE_NAMES, regulators, (node, x) => {
    const [regs, rule] = RULES[node]!;
    const v: V = {};
    regs.forEach((name, j) => (v[name] = x[j] === 1));
    return rule(v) ? 1 : 0;
  });
}
