// A 40-node model with published dynamics for the large-model tests: the mammalian cell cycle of Faure, Naldi,
// Chaouiya and Thieffry, "Dynamical analysis of a generic Boolean model for the control of the mammalian cell cycle",
// Bioinformatics 2006 (rules from the fixture written from memory), with a 30-node delay line read off CycB
// (Out1' = CycB, Out2' = Out1, ...). A delay line changes no attractor: in a cycle of period p each Out_k repeats
// CycB k steps late, so synchronous attractors match those of the 10-node model one to one, and the fixed point has
// every Out_k at CycB's value 0. Facts used by the checks (Faure et al. 2006, from memory): with CycD off one stable
// state (Rb, p27, Cdh1 on), with CycD on a synchronous cycle of 7 states.
import { readFileSync } from "node:fs";
import path from "node:path";

export const DELAY_LINE_LENGTH = 30;

const faureRules = readFileSync(
  path.join(path.dirname(new URL(import.meta.url).pathname), "../fixtures/sbml/faure-2006-cell-cycle.rules"),
  "utf8",
);

export const FAURE_WITH_DELAY_LINE =
  faureRules +
  Array.from({ length: DELAY_LINE_LENGTH }, (_, k) => `Out${k + 1}' = ${k === 0 ? "CycB" : `Out${k}`}`).join("\n") +
  "\n";

/** The published stable state (CycD, Rb, E2F, CycE, CycA, p27, Cdc20, Cdh1, UbcH10, CycB) and the quiet line. */
export const FAURE_STABLE_STATE = "0100010100" + "0".repeat(DELAY_LINE_LENGTH);
