// The verifier's own check of node-elimination and constant-percolation certificates (docs/certificates.md). It
// re-derives each kept node's function from the source by evaluation alone (substitute in the stated order, one
// truth-table row at a time, then drop the inputs the function does not depend on) and compares it row by row with
// the certificate's target. It imports nothing from the elimination or percolation engines, so that a bug there
// cannot vouch for itself.

/** A function of source nodes: `inputs` are source node indices, row r of `table` has bit j = value of inputs[j]. */
export interface SourceFunction {
  readonly inputs: readonly number[];
  readonly table: Uint8Array;
}

export interface SubstitutionNet {
  readonly names: readonly string[];
  readonly index: ReadonlyMap<string, number>;
  readonly inputs: readonly (readonly number[])[];
  readonly tables: readonly Uint8Array[];
}

/** Most inputs a function may reach during the check: the certificate format's (and the engine's) limit. */
export const MAX_SUBSTITUTION_INPUTS = 20;

/** Most truth-table rows one check may evaluate, about the cost of the other verifiers' bound. */
export const MAX_SUBSTITUTION_ROWS = 2 ** 27;

/** A reason the certificate does not hold; the caller turns it into the report's problem. */
export class SubstitutionProblem extends Error {}

function fail(message: string): never {
  throw new SubstitutionProblem(message);
}

class Budget {
  rows = 0;
  spend(rows: number): void {
    this.rows += rows;
    if (this.rows > MAX_SUBSTITUTION_ROWS) fail(`checking needs more than ${MAX_SUBSTITUTION_ROWS} truth-table rows`);
  }
}

function rowOf(f: SourceFunction, value: (v: number) => number): number {
  let row = 0;
  for (let j = 0; j < f.inputs.length; j++) row += value(f.inputs[j]!) * 2 ** j;
  return row;
}

/** The function on only the inputs it depends on: input j stays when flipping it changes some row. */
function essential(f: SourceFunction, budget: Budget): SourceFunction {
  budget.spend(f.table.length);
  const keep: number[] = [];
  f.inputs.forEach((_, j) => {
    const bit = 1 << j;
    for (let row = 0; row < f.table.length; row++)
      if ((row & bit) === 0 && f.table[row] !== f.table[row | bit]) {
        keep.push(j);
        return;
      }
  });
  if (keep.length === f.inputs.length) return f;
  const table = new Uint8Array(1 << keep.length);
  for (let row = 0; row < table.length; row++) {
    let full = 0;
    for (let q = 0; q < keep.length; q++) full |= ((row >> q) & 1) << keep[q]!;
    table[row] = f.table[full]!;
  }
  return { inputs: keep.map((j) => f.inputs[j]!), table };
}

/**
 * For each value x of `width` consecutive row bits starting at bit `from`: the bits of a function's row they set,
 * where `at[j]` is the row bit that feeds input j.
 */
function spread(at: readonly number[], from: number, width: number): Int32Array {
  const out = new Int32Array(1 << width);
  for (let x = 0; x < out.length; x++) {
    let r = 0;
    for (let j = 0; j < at.length; j++) {
      const p = at[j]! - from;
      if (p >= 0 && p < width) r |= ((x >> p) & 1) << j;
    }
    out[x] = r;
  }
  return out;
}

/** f with g's function put in place of input v, tabulated row by row over the union of their other inputs. */
function substitute(f: SourceFunction, v: number, g: SourceFunction, budget: Budget, what: string): SourceFunction {
  const merged = f.inputs.filter((u) => u !== v);
  for (const u of g.inputs) if (!merged.includes(u)) merged.push(u);
  if (merged.length > MAX_SUBSTITUTION_INPUTS)
    fail(`${what} would read ${merged.length} nodes; at most ${MAX_SUBSTITUTION_INPUTS} are checked`);
  // Where each input of g and of f sits in a row of the merged table (-1: f's input v, which takes g's value). A row's
  // bits go to g's and f's rows bit by bit, so each half of the row is looked up in a table made once.
  const gAt = g.inputs.map((u) => merged.indexOf(u));
  const fAt = f.inputs.map((u) => (u === v ? -1 : merged.indexOf(u)));
  const vBit = 1 << fAt.indexOf(-1);
  const low = merged.length >> 1;
  const lowMask = (1 << low) - 1;
  const [gLow, gHigh] = [spread(gAt, 0, low), spread(gAt, low, merged.length - low)];
  const [fLow, fHigh] = [spread(fAt, 0, low), spread(fAt, low, merged.length - low)];
  const table = new Uint8Array(1 << merged.length);
  budget.spend(table.length);
  for (let row = 0; row < table.length; row++) {
    const lo = row & lowMask;
    const hi = row >> low;
    const gv = g.table[gLow[lo]! | gHigh[hi]!]!;
    table[row] = f.table[fLow[lo]! | fHigh[hi]! | (gv ? vBit : 0)]!;
  }
  return essential({ inputs: merged, table }, budget);
}

/**
 * The stated target node (its inputs named in the target, which names kept source nodes) equals `derived` on every
 * row of their joint inputs, with `fixedValue` giving the value of removed nodes that `derived` may still read.
 */
function compare(
  source: SubstitutionNet,
  target: SubstitutionNet,
  j: number,
  derived: SourceFunction,
  fixedValue: (v: number) => number | undefined,
  budget: Budget,
): number {
  const stated: SourceFunction = {
    inputs: target.inputs[j]!.map((k) => source.index.get(target.names[k]!)!),
    table: target.tables[j]!,
  };
  const free = [...stated.inputs];
  for (const u of derived.inputs) if (fixedValue(u) === undefined && !free.includes(u)) free.push(u);
  if (free.length > MAX_SUBSTITUTION_INPUTS)
    fail(`target node "${target.names[j]}" is compared on ${free.length} inputs; at most 20 are checked`);
  const rows = 2 ** free.length;
  budget.spend(rows);
  // Row bits to the two functions' rows, half a row at a time; fixed nodes feed derived's row a constant.
  const statedAt = stated.inputs.map((u) => free.indexOf(u));
  const derivedAt = derived.inputs.map((u) => (fixedValue(u) === undefined ? free.indexOf(u) : -1));
  let derivedFixed = 0;
  derived.inputs.forEach((u, q) => (derivedFixed |= (fixedValue(u) ?? 0) << q));
  const low = free.length >> 1;
  const lowMask = (1 << low) - 1;
  const [sLow, sHigh] = [spread(statedAt, 0, low), spread(statedAt, low, free.length - low)];
  const [dLow, dHigh] = [spread(derivedAt, 0, low), spread(derivedAt, low, free.length - low)];
  for (let row = 0; row < rows; row++) {
    const lo = row & lowMask;
    const hi = row >> low;
    const want = derived.table[dLow[lo]! | dHigh[hi]! | derivedFixed]!;
    const got = stated.table[sLow[lo]! | sHigh[hi]!]!;
    if (want !== got) {
      const at = free.map((u, q) => `${source.names[u]}=${(row >> q) & 1}`).join(", ") || "its only row";
      fail(
        `target node "${target.names[j]}" gives ${got} at ${at}, but the source with the substitutions gives ${want}`,
      );
    }
  }
  return rows;
}

/** The target must list exactly the kept source nodes, in source order, under the same names. */
function checkKept(source: SubstitutionNet, target: SubstitutionNet, removed: ReadonlySet<number>): number[] {
  const kept = source.names.flatMap((_, v) => (removed.has(v) ? [] : [v]));
  if (kept.length !== target.names.length)
    fail(`the target must have the ${kept.length} source nodes that were not removed; it has ${target.names.length}`);
  kept.forEach((v, j) => {
    if (target.names[j] !== source.names[v])
      fail(`target node ${j + 1} must be "${source.names[v]}" (the kept source nodes in source order)`);
  });
  return kept;
}

function sourceFunctions(source: SubstitutionNet, budget: Budget): SourceFunction[] {
  return source.names.map((_, v) => essential({ inputs: source.inputs[v]!, table: source.tables[v]! }, budget));
}

/** Node elimination: returns the number of truth-table rows compared with the target. */
export function checkNodeElimination(source: SubstitutionNet, target: SubstitutionNet, order: string[]): number {
  if (order.length === 0) fail("the witness must eliminate at least one node");
  const budget = new Budget();
  const steps = order.map((name) => {
    const v = source.index.get(name);
    if (v === undefined) fail(`the witness eliminates unknown source node "${name}"`);
    return v;
  });
  if (new Set(steps).size !== steps.length) fail("the witness eliminates a node twice");
  const fns = sourceFunctions(source, budget);
  const alive = new Uint8Array(source.names.length).fill(1);
  steps.forEach((v, k) => {
    const g = fns[v]!;
    if (g.inputs.includes(v))
      fail(`node "${source.names[v]}" regulates itself at its turn (step ${k + 1}), so it cannot be eliminated`);
    alive[v] = 0;
    for (let u = 0; u < fns.length; u++)
      if (alive[u] && fns[u]!.inputs.includes(v))
        fns[u] = substitute(fns[u]!, v, g, budget, `after eliminating "${source.names[v]}", node "${source.names[u]}"`);
  });
  const kept = checkKept(source, target, new Set(steps));
  let rows = 0;
  kept.forEach((v, j) => (rows += compare(source, target, j, fns[v]!, () => undefined, budget)));
  return rows;
}

function binaryRecord(v: unknown, what: string, source: SubstitutionNet): Map<number, number> {
  if (typeof v !== "object" || v === null || Array.isArray(v)) fail(`${what} must be an object of node values`);
  const out = new Map<number, number>();
  for (const [name, value] of Object.entries(v)) {
    const i = source.index.get(name);
    if (i === undefined) fail(`${what} names unknown source node "${name}"`);
    if (value !== 0 && value !== 1) fail(`${what}: the value of "${name}" must be 0 or 1`);
    out.set(i, value);
  }
  return out;
}

/**
 * The constant that f takes whatever the nodes outside `known` are, or null when it still varies. Enumerates the
 * rows of its unknown inputs only.
 */
function constantUnder(f: SourceFunction, known: ReadonlyMap<number, number>, budget: Budget): number | null {
  const open = f.inputs.filter((u) => !known.has(u));
  const position = new Map(open.map((u, q) => [u, q] as const));
  const rows = 2 ** open.length;
  budget.spend(rows);
  let seen: number | null = null;
  for (let row = 0; row < rows; row++) {
    const out = f.table[rowOf(f, (u) => known.get(u) ?? Math.floor(row / 2 ** position.get(u)!) % 2)]!;
    if (seen === null) seen = out;
    else if (seen !== out) return null;
  }
  return seen;
}

/**
 * Constant percolation: the held nodes are constants, every other fixed node's function must become constant (at its
 * stated value) once the nodes already confirmed take their values, and the target must be the rest of the source
 * with those values put in. Returns the number of truth-table rows compared with the target.
 */
export function checkPercolation(
  source: SubstitutionNet,
  target: SubstitutionNet,
  heldJson: unknown,
  fixedJson: unknown,
): number {
  const budget = new Budget();
  const held = binaryRecord(heldJson, "held", source);
  const fixed = binaryRecord(fixedJson, "fixed", source);
  for (const [v, value] of held)
    if (fixed.get(v) !== value) fail(`held node "${source.names[v]}" must be listed as fixed at ${value}`);
  const fns = sourceFunctions(source, budget).map((f, v) =>
    held.has(v) ? { inputs: [], table: Uint8Array.of(held.get(v)!) } : f,
  );
  const confirmed = new Map<number, number>();
  for (let progress = true; progress;) {
    progress = false;
    for (const [v, value] of fixed) {
      if (confirmed.has(v)) continue;
      const c = constantUnder(fns[v]!, confirmed, budget);
      if (c === null) continue;
      if (c !== value)
        fail(`node "${source.names[v]}" is forced to ${c} by the values fixed before it, not to ${value}`);
      confirmed.set(v, value);
      progress = true;
    }
  }
  for (const v of fixed.keys())
    if (!confirmed.has(v))
      fail(`the value of "${source.names[v]}" is not forced by the held nodes and the constants of the model`);
  const kept = checkKept(source, target, new Set(fixed.keys()));
  let rows = 0;
  kept.forEach((v, j) => (rows += compare(source, target, j, fns[v]!, (u) => fixed.get(u), budget)));
  return rows;
}
