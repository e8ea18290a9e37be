// Canonical form of a small target map up to renaming its nodes and swapping each node's two codewords (the
// hyperoctahedral group acting on {0,1}^m), and flags for targets whose dynamics carry no interaction
// (common practice in classifying reductions: constant, identity and decoupled maps are uninformative).
import { EngineError } from "../errors";

/** All orderings of 0..m-1. */
export function permutations(m: number): number[][] {
  if (m === 0) return [[]];
  const out: number[][] = [];
  for (const p of permutations(m - 1))
    for (let i = 0; i <= p.length; i++) out.push([...p.slice(0, i), m - 1, ...p.slice(i)]);
  return out;
}

/** Every table T g T^-1 for T a node renaming composed with value swaps (with repetitions when g has symmetries). */
export function relabelledTables(succ: ArrayLike<number>, m: number): number[][] {
  if (m > 5) throw new EngineError("TOO_LARGE", "relabellings are listed for targets of at most 5 nodes");
  const size = 2 ** m;
  const out: number[][] = [];
  for (const perm of permutations(m)) {
    const move = (x: number) => {
      let y = 0;
      for (let i = 0; i < m; i++) if ((x >>> i) & 1) y |= 1 << perm[i]!;
      return y;
    };
    for (let flip = 0; flip < size; flip++) {
      const h = new Array<number>(size);
      for (let x = 0; x < size; x++) h[move(x) ^ flip] = move(succ[x]!) ^ flip;
      out.push(h);
    }
  }
  return out;
}

/** The lexicographically smallest relabelling of `succ` (length 2^m) over all node renamings and value swaps. */
export function canonicalTargetKey(succ: ArrayLike<number>, m: number): string {
  let best: number[] | null = null;
  for (const h of relabelledTables(succ, m)) if (best === null || lexLess(h, best)) best = h;
  return `${m}:${best!.join(",")}`;
}

function lexLess(a: readonly number[], b: readonly number[]): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i]! < b[i]!;
  return false;
}

export type TargetFlag = "constant" | "identity" | "decoupled";

/**
 * Why a target map is uninformative: all states go to one state, nothing moves, or (with two or more nodes) no node
 * reads another, so the target is just smaller targets side by side. A one-node target reads no other node by
 * definition; its negation (a period-2 oscillation) is informative and must not be flagged.
 */
export function trivialityFlags(succ: ArrayLike<number>, m: number): TargetFlag[] {
  const flags: TargetFlag[] = [];
  const size = 2 ** m;
  let constant = true;
  let identity = true;
  for (let x = 0; x < size; x++) {
    if (succ[x] !== succ[0]) constant = false;
    if (succ[x] !== x) identity = false;
  }
  if (constant) flags.push("constant");
  if (identity) flags.push("identity");
  if (m >= 2 && interactionCount(succ, m) === 0) flags.push("decoupled");
  return flags;
}

/** Number of ordered pairs (i, j), i != j, where node i's next value depends on node j. */
export function interactionCount(succ: ArrayLike<number>, m: number): number {
  let count = 0;
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      if (i === j) continue;
      for (let x = 0; x < 2 ** m; x++) {
        if (((succ[x]! >>> i) & 1) !== ((succ[x ^ (1 << j)]! >>> i) & 1)) {
          count++;
          break;
        }
      }
    }
  }
  return count;
}
