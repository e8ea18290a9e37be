// Phenotype labels: an attractor read through chosen marker nodes, each marker on (1), off (0) or oscillating
// along a cycle, the read-out used to map attractors to cell fates (e.g. Huang and Ingber, "Shape-dependent
// control of cell growth, differentiation, and apoptosis", Exp. Cell Research 2000).

export type MarkerValue = "0" | "1" | "~";

export interface PhenotypeLabel {
  /** One value per marker, in the order the markers were given. */
  pattern: MarkerValue[];
  /** Readable label such as "CycB=1 Cdh1=0 Cdc20~". */
  label: string;
}

/** Label one attractor (its states as node-ordered 0/1 text) by the given marker nodes. */
export function phenotypeLabel(
  states: readonly string[],
  markers: readonly number[],
  names: readonly string[],
): PhenotypeLabel {
  const pattern = markers.map((m): MarkerValue => {
    const first = states[0]![m]!;
    return states.every((s) => s[m] === first) ? (first as "0" | "1") : "~";
  });
  const label = markers.map((m, q) => (pattern[q] === "~" ? `${names[m]}~` : `${names[m]}=${pattern[q]}`)).join(" ");
  return { pattern, label };
}

/** Group attractor indices by phenotype label, in order of first appearance. */
export function groupByPhenotype(
  attractors: readonly { states: readonly string[] }[],
  markers: readonly number[],
  names: readonly string[],
): { label: string; pattern: MarkerValue[]; attractors: number[] }[] {
  const groups = new Map<string, { label: string; pattern: MarkerValue[]; attractors: number[] }>();
  attractors.forEach((a, index) => {
    const p = phenotypeLabel(a.states, markers, names);
    const group = groups.get(p.label) ?? { ...p, attractors: [] };
    group.attractors.push(index);
    groups.set(p.label, group);
  });
  return [...groups.values()];
}
