// Checks of a large hierarchy against itself, for block sizes no outside table reaches: a hierarchy to K must
// contain the one to a smaller K unchanged, every pair first found above the smaller K must replay in the
// independent simulator, and the relation must be closed under the reflection and complement symmetries
// (Li & Packard, Complex Systems 4, 1990, for the symmetry classes; the equivariance itself is common practice).
import { ecaRule, reflectEca, complementEca } from "../automata";
import type { EcaHierarchy, HierarchyRelation } from "./eca-hierarchy";
import { verifyEmulation } from "./verify-emulation";

export interface HierarchySelfCheck {
  readonly maxBlock: number;
  readonly smallerMaxBlock: number;
  /** Relations of the smaller hierarchy absent from the larger one or with another least block. */
  readonly lost: HierarchyRelation[];
  /** Relations of the larger hierarchy at a block the smaller covers that the smaller one lacks. */
  readonly unexpected: HierarchyRelation[];
  /** Relations first found above the smaller maximum, with the number whose witness the simulator rejected. */
  readonly newPairs: number;
  readonly newPairsRejected: HierarchyRelation[];
  /** Relations whose reflected, complemented or conjugated image is missing or has another least block. */
  readonly symmetryBreaks: HierarchyRelation[];
  /** Mutual classes whose image under a symmetry is not a mutual class. */
  readonly classBreaks: number[][];
  readonly composedRejected: number;
  readonly ok: boolean;
}

export function checkHierarchyAgainstSmaller(big: EcaHierarchy, small: EcaHierarchy): HierarchySelfCheck {
  const least = (h: EcaHierarchy) => {
    const table = new Uint8Array(65536);
    for (const r of h.relations) table[256 * r.source + r.target] = r.minBlock;
    return table;
  };
  const bigLeast = least(big);
  const smallLeast = least(small);
  const lost = small.relations.filter((r) => bigLeast[256 * r.source + r.target] !== r.minBlock);
  const unexpected = big.relations.filter(
    (r) => r.minBlock <= small.maxBlock && smallLeast[256 * r.source + r.target] !== r.minBlock,
  );
  const fresh = big.relations.filter((r) => r.minBlock > small.maxBlock);
  const newPairsRejected = fresh.filter((r) => !verifyEmulation(ecaRule(r.source), r.target, r.u0, r.u1).valid);
  // F -> G at k iff reflect F -> reflect G, complement F -> complement G (conjugating both) and complement F -> G
  // (complementing the codewords) at k
  const symmetryBreaks = big.relations.filter(
    (r) =>
      bigLeast[256 * reflectEca(r.source) + reflectEca(r.target)] !== r.minBlock ||
      bigLeast[256 * complementEca(r.source) + complementEca(r.target)] !== r.minBlock ||
      bigLeast[256 * complementEca(r.source) + r.target] !== r.minBlock,
  );
  const classOf = new Map<number, string>();
  for (const c of big.mutualClasses) for (const f of c) classOf.set(f, c.join(","));
  const classBreaks = big.mutualClasses.filter((c) =>
    [reflectEca, complementEca].some((g) => {
      const image = c.map(g).sort((a, b) => a - b);
      return classOf.get(image[0]!) !== image.join(",");
    }),
  );
  const composedRejected = big.composed.filter((c) => c.verified === false).length;
  return {
    maxBlock: big.maxBlock,
    smallerMaxBlock: small.maxBlock,
    lost,
    unexpected,
    newPairs: fresh.length,
    newPairsRejected,
    symmetryBreaks,
    classBreaks,
    composedRejected,
    ok:
      lost.length === 0 &&
      unexpected.length === 0 &&
      newPairsRejected.length === 0 &&
      symmetryBreaks.length === 0 &&
      classBreaks.length === 0 &&
      composedRejected === 0,
  };
}
