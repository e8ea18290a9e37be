// The two symmetries of binary cellular-automaton rules: left-right reflection and 0/1 complement (conjugation by
// the state swap). Under both, the 256 elementary rules fall into 88 classes (Li & Packard, "The structure of the
// elementary cellular automata rule space", Complex Systems 4, 1990).
import type { RuleTable } from "./rule-table";
import { ecaRule, ecaNumber } from "./rule-table";

/** The mirror image: the neighbourhood is read right to left. */
export function reflectRule(rule: RuleTable): RuleTable {
  const n = 2 * rule.radius + 1;
  const table = new Uint8Array(rule.table.length);
  for (let i = 0; i < table.length; i++) {
    let rev = 0;
    for (let b = 0; b < n; b++) rev |= ((i >> b) & 1) << (n - 1 - b);
    table[i] = rule.table[rev]!;
  }
  return { radius: rule.radius, table };
}

/** The conjugate by complement: x -> not F(not x). */
export function complementRule(rule: RuleTable): RuleTable {
  const mask = rule.table.length - 1;
  const table = new Uint8Array(rule.table.length);
  for (let i = 0; i < table.length; i++) table[i] = 1 - rule.table[mask ^ i]!;
  return { radius: rule.radius, table };
}

export function reflectEca(n: number): number {
  return ecaNumber(reflectRule(ecaRule(n)));
}

export function complementEca(n: number): number {
  return ecaNumber(complementRule(ecaRule(n)));
}

/** The images of an elementary rule under identity, reflection, complement and both, in that order. */
export function ecaSymmetryImages(n: number): [number, number, number, number] {
  const r = reflectEca(n);
  return [n, r, complementEca(n), complementEca(r)];
}

/** The classes of the 256 elementary rules under reflection and complement, each sorted, ordered by least member. */
export function ecaSymmetryClasses(): number[][] {
  const seen = new Uint8Array(256);
  const classes: number[][] = [];
  for (let n = 0; n < 256; n++) {
    if (seen[n]) continue;
    const members = [...new Set(ecaSymmetryImages(n))].sort((a, b) => a - b);
    for (const m of members) seen[m] = 1;
    classes.push(members);
  }
  return classes;
}
