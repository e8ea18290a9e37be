// Attractors of large networks found by sampling: synchronous runs from seeded random initial states until the
// trajectory closes a cycle, detected with Brent's method ("An improved Monte Carlo factorization algorithm",
// BIT 1980). The result is a lower bound on the attractor set: states never sampled may lead elsewhere.
import { rotateToSmallest } from "../bits";
import { CancelledError } from "../errors";
import type { BooleanNetwork } from "../network";
import { bytesToString, synchronousStep, type LongTaskOptions } from "../update";

export interface SampledAttractor {
  length: number;
  /** Cycle states as node-ordered 0/1 text, starting at the smallest text and following the dynamics. */
  states: string[];
  /** How many of the random starts ended on this attractor. */
  hits: number;
}

export interface SampledAttractors {
  /** Always "found so far": the sample cannot prove that no other attractor exists. */
  completeness: "found so far";
  samples: number;
  /** Starts whose trajectory had not closed a cycle within maxSteps. */
  unresolved: number;
  /** Sorted by hits descending, then by the text of the first state. */
  attractors: SampledAttractor[];
}

export interface SampleOptions extends LongTaskOptions {
  samples: number;
  /** Seeded generator of numbers in [0, 1). */
  rng: () => number;
  /** Largest number of steps tried from one start before giving up on it. */
  maxSteps?: number;
}

function equal(a: Uint8Array, b: Uint8Array): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

export function sampleAttractors(net: BooleanNetwork, options: SampleOptions): SampledAttractors {
  const n = net.names.length;
  const { samples, rng, onProgress, shouldStop } = options;
  const maxSteps = options.maxSteps ?? 100_000;
  const byFirst = new Map<string, SampledAttractor>();
  let unresolved = 0;
  for (let sample = 0; sample < samples; sample++) {
    if (shouldStop?.()) throw new CancelledError();
    onProgress?.(sample / samples, "sampling");
    const start = new Uint8Array(n);
    for (let i = 0; i < n; i++) start[i] = rng() < 0.5 ? 1 : 0;
    // Brent: the tortoise jumps to the hare at each power of two; lambda ends as the cycle length.
    let power = 1;
    let lambda = 1;
    let tortoise: Uint8Array = start;
    let hare: Uint8Array = synchronousStep(net, start);
    let steps = 1;
    while (!equal(tortoise, hare) && steps < maxSteps) {
      if (power === lambda) {
        tortoise = hare;
        power *= 2;
        lambda = 0;
      }
      hare = synchronousStep(net, hare);
      lambda++;
      steps++;
    }
    if (!equal(tortoise, hare)) {
      unresolved++;
      continue;
    }
    const cycle: string[] = [];
    let x = hare;
    for (let q = 0; q < lambda; q++) {
      cycle.push(bytesToString(x));
      x = synchronousStep(net, x);
    }
    const states = rotateToSmallest(cycle, (a, b) => a < b);
    const known = byFirst.get(states[0]!);
    if (known) known.hits++;
    else byFirst.set(states[0]!, { length: states.length, states, hits: 1 });
  }
  onProgress?.(1, "sampling");
  const attractors = [...byFirst.values()].sort((a, b) => b.hits - a.hits || (a.states[0]! < b.states[0]! ? -1 : 1));
  return { completeness: "found so far", samples, unresolved, attractors };
}
