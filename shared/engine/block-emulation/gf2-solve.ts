// Linear systems over GF(2) by Gauss-Jordan elimination (any linear-algebra text, e.g. Lidl & Niederreiter,
// "Finite Fields", 1997, ch. 1), used by the exact search for affine emulators.

export interface Gf2Solution {
  /** One solution (free unknowns 0), or null when the system has none. */
  readonly particular: Uint8Array | null;
  /** A basis of the solutions of the homogeneous system. */
  readonly kernel: Uint8Array[];
}

/** Solve sum_j x_j * columns[j] = target, all vectors of 0/1 entries of the same length. */
export function solveGf2(columns: readonly Uint8Array[], target: Uint8Array): Gf2Solution {
  const unknowns = columns.length;
  const rows = target.length;
  const m: Uint8Array[] = [];
  for (let i = 0; i < rows; i++) {
    const row = new Uint8Array(unknowns + 1);
    for (let j = 0; j < unknowns; j++) row[j] = columns[j]![i]!;
    row[unknowns] = target[i]!;
    m.push(row);
  }
  const pivotOfColumn = new Int32Array(unknowns).fill(-1);
  let rank = 0;
  for (let col = 0; col < unknowns && rank < rows; col++) {
    let p = rank;
    while (p < rows && !m[p]![col]) p++;
    if (p === rows) continue;
    [m[rank], m[p]] = [m[p]!, m[rank]!];
    const pr = m[rank]!;
    for (let i = 0; i < rows; i++) {
      if (i === rank || !m[i]![col]) continue;
      const row = m[i]!;
      for (let j = col; j <= unknowns; j++) row[j]! ^= pr[j]!;
    }
    pivotOfColumn[col] = rank;
    rank++;
  }
  let consistent = true;
  for (let i = rank; i < rows; i++) if (m[i]![unknowns]) consistent = false;
  let particular: Uint8Array | null = null;
  if (consistent) {
    particular = new Uint8Array(unknowns);
    for (let col = 0; col < unknowns; col++)
      if (pivotOfColumn[col]! >= 0) particular[col] = m[pivotOfColumn[col]!]![unknowns]!;
  }
  const kernel: Uint8Array[] = [];
  for (let free = 0; free < unknowns; free++) {
    if (pivotOfColumn[free]! >= 0) continue;
    const v = new Uint8Array(unknowns);
    v[free] = 1;
    for (let col = 0; col < unknowns; col++) if (pivotOfColumn[col]! >= 0) v[col] = m[pivotOfColumn[col]!]![free]!;
    kernel.push(v);
  }
  return { particular, kernel };
}
