// Attractors before and after a perturbation, matched by their states (same cycle, read from its canonical first
// state); unmatched ones are reported as lost or new, as in mutant-versus-wild-type attractor comparisons.

export interface AttractorLike {
  /** Canonical cycle: node-ordered 0/1 text, starting at the smallest text. */
  states: readonly string[];
}

export interface AttractorComparison<A extends AttractorLike> {
  kept: { before: A; after: A }[];
  lost: A[];
  gained: A[];
}

export function compareAttractors<A extends AttractorLike>(
  before: readonly A[],
  after: readonly A[],
): AttractorComparison<A> {
  const key = (a: A) => a.states.join(",");
  const afterByKey = new Map(after.map((a) => [key(a), a]));
  const kept: { before: A; after: A }[] = [];
  const lost: A[] = [];
  for (const b of before) {
    const match = afterByKey.get(key(b));
    if (match) {
      kept.push({ before: b, after: match });
      afterByKey.delete(key(b));
    } else lost.push(b);
  }
  const gained = after.filter((a) => afterByKey.has(key(a)));
  return { kept, lost, gained };
}
