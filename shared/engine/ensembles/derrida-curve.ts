// One-step damage spreading (the Derrida curve): for pairs of states at normalised Hamming distance a, the mean
// normalised distance after one synchronous step, compared with the annealed approximation
// a(t+1) = 2p(1-p)[1 - (1-a)^K] of Derrida and Pomeau, "Random networks of automata: a simple annealed
// approximation", Europhysics Letters 1986.
import { CancelledError } from "../errors";
import type { BooleanNetwork } from "../network";
import { synchronousStep, type LongTaskOptions } from "../update";

export interface DerridaPoint {
  /** Normalised distance before the step (flipped nodes / n, after rounding to whole nodes). */
  before: number;
  /** Mean normalised distance after one step. */
  after: number;
}

export interface DerridaOptions extends LongTaskOptions {
  /** Requested distances before the step, each in [0, 1]. */
  distances: readonly number[];
  /** Random state pairs per network and per distance. */
  pairs: number;
  /** Seeded generator of numbers in [0, 1). */
  rng: () => number;
}

/** The annealed approximation of the one-step damage for K inputs per node and output bias p. */
export function annealedDamage(a: number, k: number, p: number): number {
  return 2 * p * (1 - p) * (1 - (1 - a) ** k);
}

/** Mean one-step damage over the given networks (all of the same size). */
export function derridaCurve(networks: readonly BooleanNetwork[], options: DerridaOptions): DerridaPoint[] {
  const { distances, pairs, rng, onProgress, shouldStop } = options;
  const n = networks[0]?.names.length ?? 0;
  const x = new Uint8Array(n);
  const y = new Uint8Array(n);
  const fx = new Uint8Array(n);
  const fy = new Uint8Array(n);
  const order = Int32Array.from({ length: n }, (_, i) => i);
  return distances.map((a, q) => {
    if (shouldStop?.()) throw new CancelledError();
    onProgress?.(q / distances.length, "damage spreading");
    const flips = Math.round(a * n);
    let total = 0;
    for (const net of networks) {
      for (let t = 0; t < pairs; t++) {
        for (let i = 0; i < n; i++) x[i] = y[i] = rng() < 0.5 ? 1 : 0;
        // Partial Fisher-Yates shuffle picks `flips` distinct nodes to differ.
        for (let i = 0; i < flips; i++) {
          const j = i + Math.floor(rng() * (n - i));
          const tmp = order[i]!;
          order[i] = order[j]!;
          order[j] = tmp;
          y[order[i]!] = 1 - y[order[i]!]!;
        }
        synchronousStep(net, x, fx);
        synchronousStep(net, y, fy);
        let d = 0;
        for (let i = 0; i < n; i++) d += fx[i] !== fy[i] ? 1 : 0;
        total += d / n;
      }
    }
    return { before: n ? flips / n : 0, after: total / Math.max(1, networks.length * pairs) };
  });
}
