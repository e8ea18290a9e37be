// Kauffman's random Boolean networks: N nodes, each with K distinct regulators drawn uniformly from all N nodes
// (self-regulation allowed) and each truth-table entry 1 with probability p (the bias).
// Reference: Kauffman, "Metabolic stability and epigenesis in randomly constructed genetic nets", J. Theor. Biol. 1969.
import { EngineError } from "../errors";
import { checkNetwork, type BooleanNetwork } from "../network";

export interface NkOptions {
  readonly n: number;
  readonly k: number;
  /** Probability that a table entry is 1; 0.5 when omitted. */
  readonly p?: number;
  /** Seeded uniform generator on [0, 1), e.g. seedrandom(String(seed)). */
  readonly random: () => number;
}

/** K distinct indices from 0..n-1, uniform over all K-subsets, returned in ascending order (partial Fisher-Yates). */
export function sampleDistinct(n: number, k: number, random: () => number): number[] {
  const pool = Array.from({ length: n }, (_, i) => i);
  for (let j = 0; j < k; j++) {
    const pick = j + Math.floor(random() * (n - j));
    [pool[j], pool[pick]] = [pool[pick]!, pool[j]!];
  }
  return pool.slice(0, k).sort((a, b) => a - b);
}

export function nkNetwork({ n, k, p = 0.5, random }: NkOptions): BooleanNetwork {
  if (!Number.isInteger(n) || n < 1) throw new EngineError("BAD_ARGUMENT", `N must be a positive integer, got ${n}`);
  if (!Number.isInteger(k) || k < 0 || k > n)
    throw new EngineError("BAD_ARGUMENT", `K must be an integer from 0 to N = ${n}, got ${k}`);
  if (k > 20) throw new EngineError("BAD_ARGUMENT", `K = ${k} is more than the 20 regulators a node may have`);
  if (!(p >= 0 && p <= 1)) throw new EngineError("BAD_ARGUMENT", `p must lie in [0, 1], got ${p}`);
  const names = Array.from({ length: n }, (_, i) => `x${i}`);
  const regulators: Int32Array[] = [];
  const tables: Uint8Array[] = [];
  for (let i = 0; i < n; i++) {
    regulators.push(Int32Array.from(sampleDistinct(n, k, random)));
    const table = new Uint8Array(1 << k);
    for (let row = 0; row < table.length; row++) table[row] = random() < p ? 1 : 0;
    tables.push(table);
  }
  return checkNetwork({ names, regulators, tables });
}
