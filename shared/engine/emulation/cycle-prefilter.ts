// A necessary condition for block emulation checked before any search: e is one-to-one and maps G's attractors onto
// attractors of F^t of the same length, so for every cycle length G needs at least as many cycles in F^t
// (Wuensche, Lesser, "The Global Dynamics of Cellular Automata", Addison-Wesley, 1992, for attractor counting).

/** Number of cycles of each length in the functional graph of `succ`. */
export function cycleLengthCounts(succ: ArrayLike<number>): Map<number, number> {
  const N = succ.length;
  const mark = new Int32Array(N).fill(-1); // walk id that first visited the state
  const counts = new Map<number, number>();
  for (let start = 0; start < N; start++) {
    if (mark[start] !== -1) continue;
    let x = start;
    while (mark[x] === -1) {
      mark[x] = start;
      x = succ[x]!;
    }
    if (mark[x] !== start) continue; // ran into an earlier walk: no new cycle
    let length = 1;
    for (let y = succ[x]!; y !== x; y = succ[y]!) length++;
    counts.set(length, (counts.get(length) ?? 0) + 1);
  }
  return counts;
}

/** Does F^t have, for every cycle length of G, at least as many cycles as G? */
export function cyclesFit(sourceCounts: Map<number, number>, targetCounts: Map<number, number>): boolean {
  for (const [length, count] of targetCounts) if ((sourceCounts.get(length) ?? 0) < count) return false;
  return true;
}
