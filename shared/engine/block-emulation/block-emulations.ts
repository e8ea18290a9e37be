// Search for every elementary rule G that a rule F emulates with block size k and time t, one witness (u0, u1)
// each (block simulation as in Delorme, Mazoyer, Ollinger, Theyssier, "Bulking I", Theor. Comput. Sci. 412, 2011).
// Pruning: u_a u_a u_a must map to a codeword, so m(u0) = u1, m(u1) = u0, or both are fixed points of m (m = F^t on
// a ring of k cells); only those pairs are examined. Affine rules are solved by linear algebra instead.
import { CancelledError, EngineError } from "../errors";
import type { RuleTable } from "../automata";
import { isAffineRule, packedToString, complementEca } from "../automata";
import { middleBlockMap } from "./middle-block-map";
import type { PackedEmulation } from "./affine-emulations";
import { affineEmulations } from "./affine-emulations";

export interface Emulation {
  readonly target: number;
  /** The codewords of 0 and 1, leftmost cell first. */
  readonly u0: string;
  readonly u1: string;
}

export interface BlockEmulationResult {
  readonly block: number;
  readonly time: number;
  /** One entry per emulated elementary rule, targets ascending. */
  readonly emulations: Emulation[];
  /** Candidate codeword pairs whose mixed triples were simulated (0 on the affine path). */
  readonly pairsExamined: number;
  readonly method: "affine" | "fixed-points";
}

export interface BlockSearchOptions {
  shouldStop?: () => boolean;
  /**
   * Search only slice `part` of `parts` of the codeword pairs, so that one large search can spread over several
   * shards. Slices are consecutive in the search order, so taking each target from the lowest slice that found it
   * reproduces the whole search's witnesses (see mergeSliceEmulations).
   */
  part?: number;
  parts?: number;
}

/**
 * The first index of slice `part` among n items whose cost falls linearly with the index (item i is paired with the
 * n - 1 - i after it), chosen so that every slice pairs about as many.
 */
export function triangularSliceStart(n: number, part: number, parts: number): number {
  if (part <= 0) return 0;
  if (part >= parts) return n;
  return Math.round(n * (1 - Math.sqrt(1 - part / parts)));
}

/**
 * The result of the whole search from the results of its slices, given in slice order: each target keeps the
 * witness of the lowest slice that found it, as the whole search keeps the first pair it meets.
 */
export function mergeSliceEmulations(slices: readonly (readonly Emulation[])[]): Emulation[] {
  const byTarget = new Map<number, Emulation>();
  for (const list of slices) for (const e of list) if (!byTarget.has(e.target)) byTarget.set(e.target, e);
  return [...byTarget.values()].sort((p, q) => p.target - q.target);
}

const conjugate = Array.from({ length: 256 }, (_, g) => complementEca(g));

/** Below this many fixed points, plain pairing is cheaper than building the edge tables. */
const EDGE_TABLE_MIN_FIXED = 48;

export function blockEmulations(
  rule: RuleTable,
  block: number,
  time = block,
  options: BlockSearchOptions = {},
): BlockEmulationResult {
  const { part = 0, parts = 1 } = options;
  if (!Number.isInteger(parts) || parts < 1 || !Number.isInteger(part) || part < 0 || part >= parts)
    throw new EngineError("BAD_PART", `slice ${part} of ${parts} does not exist`);
  const map = middleBlockMap(rule, block, time);
  const toResult = (
    list: PackedEmulation[],
    pairsExamined: number,
    method: BlockEmulationResult["method"],
  ): BlockEmulationResult => ({
    block,
    time,
    emulations: list
      .sort((p, q) => p.target - q.target)
      .map((e) => ({ target: e.target, u0: packedToString(e.u0, block), u1: packedToString(e.u1, block) })),
    pairsExamined,
    method,
  });
  // linear algebra has no pairs to slice: the first slice does it all
  if (isAffineRule(rule)) return toResult(part === 0 ? affineEmulations(map) : [], 0, "affine");
  const { list, pairsExamined } = fixedPointSearch(map, part, parts, options.shouldStop);
  return toResult(list, pairsExamined, "fixed-points");
}

function fixedPointSearch(
  map: ReturnType<typeof middleBlockMap>,
  part: number,
  parts: number,
  shouldStop?: () => boolean,
): { list: PackedEmulation[]; pairsExamined: number } {
  const k = map.block;
  const size = 1 << k;
  const u0s = new Int32Array(256);
  const u1s = new Int32Array(256);
  const has = new Uint8Array(256);
  const record = (g: number, u0: number, u1: number) => {
    if (!has[g]) {
      has[g] = 1;
      u0s[g] = u0;
      u1s[g] = u1;
    }
    // swapping the codewords turns G into its complement conjugate
    const h = conjugate[g]!;
    if (!has[h]) {
      has[h] = 1;
      u0s[h] = u1;
      u1s[h] = u0;
    }
  };
  /** The target the pair encodes, given bits 0 and 7 already, or -1 when some mixed triple leaves the code. */
  const complete = (u0: number, u1: number, g: number): number => {
    // the mixed triples, the ones most often failing first; each output must be a codeword
    let out = map.middle(u0, u0, u1);
    if (out === u1) g |= 2;
    else if (out !== u0) return -1;
    out = map.middle(u1, u0, u0);
    if (out === u1) g |= 16;
    else if (out !== u0) return -1;
    out = map.middle(u0, u1, u0);
    if (out === u1) g |= 4;
    else if (out !== u0) return -1;
    out = map.middle(u1, u1, u0);
    if (out === u1) g |= 64;
    else if (out !== u0) return -1;
    out = map.middle(u0, u1, u1);
    if (out === u1) g |= 8;
    else if (out !== u0) return -1;
    out = map.middle(u1, u0, u1);
    if (out === u1) g |= 32;
    else if (out !== u0) return -1;
    return g;
  };
  const ring = new Int32Array(size);
  const fixed: number[] = [];
  for (let x = 0; x < size; x++) {
    const m = map.middle(x, x, x);
    ring[x] = m;
    if (m === x) fixed.push(x);
  }
  let pairs = 0;
  // m(u0) = u1 != u0: G(000) = 1 and u1 is forced; one pass over the words, cheap beside the pairing, so the first
  // slice takes it whole and stays first in the search order
  for (let u0 = 0; part === 0 && u0 < size; u0++) {
    const u1 = ring[u0]!;
    if (u1 === u0) continue;
    const m1 = ring[u1]!;
    let g: number;
    if (m1 === u1) g = 0x81;
    else if (m1 === u0) g = 0x01;
    else continue;
    pairs++;
    g = complete(u0, u1, g);
    if (g >= 0) record(g, u0, u1);
  }
  // both fixed: G(000) = 0, G(111) = 1; unordered pairs suffice since swapping gives the conjugate
  const from = triangularSliceStart(fixed.length, part, parts);
  const to = triangularSliceStart(fixed.length, part + 1, parts);
  pairs += pairFixedPoints(map, fixed, from, to, complete, record, shouldStop);
  const list: PackedEmulation[] = [];
  for (let g = 0; g < 256; g++) if (has[g]) list.push({ target: g, u0: u0s[g]!, u1: u1s[g]! });
  return { list, pairsExamined: pairs };
}

/**
 * Each unordered pair of fixed points whose first member has index from..to-1 (in the bucket order below), filtered on the triples 001 and 100 where u1 sits at one edge only: the first c
 * cells of M(u0, u0, u1) depend on u1's first c cells alone, and the last c cells of M(u1, u0, u0) on its last c
 * cells, so per-u0 tables over those c cells admit u1 only from the few prefix buckets that can map to a codeword.
 */
function pairFixedPoints(
  map: ReturnType<typeof middleBlockMap>,
  fixed: number[],
  from: number,
  to: number,
  complete: (u0: number, u1: number, g: number) => number,
  record: (g: number, u0: number, u1: number) => void,
  shouldStop?: () => boolean,
): number {
  const k = map.block;
  const nf = fixed.length;
  let pairs = 0;
  if (nf < EDGE_TABLE_MIN_FIXED) {
    for (let i = from; i < to; i++) {
      const u0 = fixed[i]!;
      for (let j = i + 1; j < nf; j++) {
        const u1 = fixed[j]!;
        pairs++;
        const g = complete(u0, u1, 0x80);
        if (g >= 0) record(g, u0, u1);
      }
    }
    return pairs;
  }
  // cost ~ nf * 2^c for the tables plus nf^2 / 2^c for the buckets: balance at 2^c ~ sqrt(nf)
  const c = Math.max(1, Math.min(k, Math.round(Math.log2(nf) / 2) + 1));
  const width = 1 << c;
  const cmask = width - 1;
  const high = k - c;
  // fixed points sorted by their first c cells, bucket b = sorted[start[b] .. start[b+1])
  const start = new Int32Array(width + 1);
  for (const u of fixed) start[(u & cmask) + 1]!++;
  for (let b = 0; b < width; b++) start[b + 1]! += start[b]!;
  const fill = start.slice(0, width);
  const sorted = new Int32Array(nf);
  for (const u of fixed) sorted[fill[u & cmask]!++] = u;
  const left = new Int32Array(width);
  const right = new Int32Array(width);
  for (let i = from; i < to; i++) {
    if (shouldStop && (i & 63) === 0 && shouldStop()) throw new CancelledError();
    const u0 = sorted[i]!;
    const u0head = u0 & cmask;
    const u0tail = u0 >>> high;
    for (let p = 0; p < width; p++) {
      left[p] = map.middle(u0, u0, p) & cmask;
      right[p] = map.middle(p << high, u0, u0) >>> high;
    }
    for (let p = 0; p < width; p++) {
      const l = left[p]!;
      if (l !== p && l !== u0head) continue;
      for (let q = Math.max(start[p]!, i + 1); q < start[p + 1]!; q++) {
        const u1 = sorted[q]!;
        const tail = u1 >>> high;
        const rt = right[tail]!;
        if (rt !== tail && rt !== u0tail) continue;
        pairs++;
        const g = complete(u0, u1, 0x80);
        if (g >= 0) record(g, u0, u1);
      }
    }
  }
  return pairs;
}
