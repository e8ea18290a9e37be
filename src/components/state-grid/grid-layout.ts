// How a grid of states is read: which columns come first (phenotype markers, then inputs, then the rest, or plain
// model order), which nodes oscillate within a cycle, and where a trajectory enters an attractor. Pure, so the
// screens and the CSV export agree on one column order.
export type ColumnGrouping = "model" | "grouped";
export type ColumnOrder = "model" | "name";

export interface ColumnGroup {
  label: string;
  /** Indices into the model's node list, in display order. */
  columns: number[];
}

export interface GridColumnOptions {
  grouping: ColumnGrouping;
  order: ColumnOrder;
  markers?: readonly string[];
  inputs?: readonly string[];
}

export function gridColumns(nodes: readonly string[], opts: GridColumnOptions): ColumnGroup[] {
  const sort = (columns: number[]) =>
    opts.order === "name"
      ? [...columns].sort((a, b) => nodes[a]!.localeCompare(nodes[b]!, "en", { numeric: true }) || a - b)
      : columns;
  const all = nodes.map((_, i) => i);
  if (opts.grouping === "model") return [{ label: "", columns: sort(all) }];
  const markers = new Set(opts.markers ?? []);
  const inputs = new Set(opts.inputs ?? []);
  const groups: ColumnGroup[] = [
    { label: "markers", columns: sort(all.filter((i) => markers.has(nodes[i]!))) },
    { label: "inputs", columns: sort(all.filter((i) => !markers.has(nodes[i]!) && inputs.has(nodes[i]!))) },
    { label: "other nodes", columns: sort(all.filter((i) => !markers.has(nodes[i]!) && !inputs.has(nodes[i]!))) },
  ];
  return groups.filter((g) => g.columns.length > 0);
}

/** For each node: does its value change among these states (the states of one cycle)? */
export function oscillatingNodes(states: readonly string[]): boolean[] {
  const first = states[0];
  if (!first) return [];
  return [...first].map((c, i) => states.some((s) => s[i] !== c));
}

export interface AttractorEntry {
  /** The first step whose state lies on an attractor. */
  step: number;
  /** Index into the attractor list, or null when the attractor was found by the trajectory repeating itself. */
  attractor: number | null;
  /** Length of the cycle entered. */
  length: number;
}

/**
 * Where a synchronous trajectory enters an attractor: the first state on one of the known attractors, or, when none
 * is known, the first state the trajectory comes back to (under synchronous update a revisited state lies on a cycle).
 */
export function attractorEntry(
  states: readonly string[],
  attractors: readonly { states: readonly string[] }[] = [],
): AttractorEntry | null {
  const onAttractor = new Map<string, number>();
  attractors.forEach((a, k) => a.states.forEach((s) => onAttractor.set(s, k)));
  for (let t = 0; t < states.length; t++) {
    const k = onAttractor.get(states[t]!);
    if (k !== undefined) return { step: t, attractor: k, length: attractors[k]!.states.length };
  }
  const firstSeen = new Map<string, number>();
  for (let t = 0; t < states.length; t++) {
    const earlier = firstSeen.get(states[t]!);
    if (earlier !== undefined) return { step: earlier, attractor: null, length: t - earlier };
    firstSeen.set(states[t]!, t);
  }
  return null;
}

/** The grid as CSV rows: a header of node names in display order, then one row per state. */
export function gridCsvRows(
  nodes: readonly string[],
  groups: readonly ColumnGroup[],
  rows: readonly { label: string; state: string; note?: string }[],
): string[][] {
  const columns = groups.flatMap((g) => g.columns);
  const withNotes = rows.some((r) => r.note);
  return [
    ["row", ...columns.map((i) => nodes[i]!), ...(withNotes ? ["note"] : [])],
    ...rows.map((r) => [r.label, ...columns.map((i) => r.state[i] ?? ""), ...(withNotes ? [r.note ?? ""] : [])]),
  ];
}
