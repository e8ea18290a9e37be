// Ensemble statistics of random Boolean networks: the distribution of attractor counts and attractor lengths over
// a family of networks drawn from seeds, the ensemble approach of Kauffman, "Metabolic stability and epigenesis
// in randomly constructed genetic nets", J. Theor. Biol. 1969. Each member is analysed exactly (up to 24 nodes).
import { CancelledError } from "../errors";
import type { BooleanNetwork } from "../network";
import { analyseSynchronous } from "../state-graph";
import type { LongTaskOptions } from "../update";

export interface EnsembleMember {
  seed: number;
  attractorCount: number;
  /** Length of each attractor of this member. */
  lengths: number[];
}

export interface AttractorStatistics {
  members: EnsembleMember[];
  /** [attractor count, number of members with that count], by increasing count. */
  countDistribution: [number, number][];
  /** [attractor length, number of attractors with that length over all members], by increasing length. */
  lengthDistribution: [number, number][];
  meanAttractorCount: number;
  meanAttractorLength: number;
}

function histogram(values: number[]): [number, number][] {
  const counts = new Map<number, number>();
  for (const v of values) counts.set(v, (counts.get(v) ?? 0) + 1);
  return [...counts.entries()].sort((a, b) => a[0] - b[0]);
}

/** Analyse the network `family(seed)` for every seed and gather the distributions. */
export function attractorStatistics(
  family: (seed: number) => BooleanNetwork,
  seeds: readonly number[],
  options: LongTaskOptions = {},
): AttractorStatistics {
  const members: EnsembleMember[] = [];
  seeds.forEach((seed, q) => {
    if (options.shouldStop?.()) throw new CancelledError();
    options.onProgress?.(q / seeds.length, "ensemble");
    const analysis = analyseSynchronous(family(seed), { shouldStop: options.shouldStop });
    members.push({
      seed,
      attractorCount: analysis.attractors.length,
      lengths: analysis.attractors.map((a) => a.length),
    });
  });
  options.onProgress?.(1, "ensemble");
  const lengths = members.flatMap((m) => m.lengths);
  return {
    members,
    countDistribution: histogram(members.map((m) => m.attractorCount)),
    lengthDistribution: histogram(lengths),
    meanAttractorCount: members.length ? members.reduce((t, m) => t + m.attractorCount, 0) / members.length : 0,
    meanAttractorLength: lengths.length ? lengths.reduce((t, l) => t + l, 0) / lengths.length : 0,
  };
}
