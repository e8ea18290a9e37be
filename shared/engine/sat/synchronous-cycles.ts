// Fixed points and synchronous cycles of exact length L of networks too large for state enumeration, by
// unrolling L steps into a SAT problem (the bounded-model-checking encoding of Dubrova and Teslenko, "A SAT-based
// algorithm for finding attractors in synchronous Boolean networks", IEEE/ACM TCBB 2011) and enumerating models
// with blocking clauses; all L rotations of a found cycle are blocked at once, and shorter periods are excluded.
import Logic from "logic-solver";
import { rotateToSmallest } from "../bits";
import { CancelledError } from "../errors";
import type { BooleanNetwork } from "../network";
import { bytesToString, type LongTaskOptions } from "../update";
import { forEachFixedPoint } from "./fixed-point-clauses";
import { tableFormula } from "./function-formula";

export interface SatCycle {
  length: number;
  /** Node-ordered 0/1 text, starting at the smallest text and following the dynamics. */
  states: string[];
}

export interface SatCycleSearch {
  /** Sorted by length, then by the text of the first state. */
  cycles: SatCycle[];
  /** False when maxSolutions cut the enumeration short: the list is then a lower bound. */
  complete: boolean;
}

export interface SatOptions extends LongTaskOptions {
  /** Stop after this many cycles in total (default 10 000). */
  maxSolutions?: number;
}

function primeFactors(x: number): number[] {
  const out: number[] = [];
  for (let p = 2; p * p <= x; p++) {
    if (x % p === 0) out.push(p);
    while (x % p === 0) x /= p;
  }
  if (x > 1) out.push(x);
  return out;
}

/** All synchronous attractors of exact length 1..maxLength (fixed points are length 1). */
export function satCycles(net: BooleanNetwork, maxLength: number, options: SatOptions = {}): SatCycleSearch {
  const n = net.names.length;
  const maxSolutions = options.maxSolutions ?? 10_000;
  const { onProgress, shouldStop } = options;
  const cycles: SatCycle[] = [];
  for (let L = 1; L <= maxLength; L++) {
    onProgress?.((L - 1) / maxLength, `cycles of length ${L}`);
    const v = (t: number, i: number) => `x${t}_${i}`;
    const solver = new Logic.Solver();
    for (let t = 0; t < L; t++) {
      const inputs = (i: number) => Array.from(net.regulators[i]!, (r) => v(t, r));
      for (let i = 0; i < n; i++)
        solver.require(Logic.equiv(v((t + 1) % L, i), tableFormula(net.tables[i]!, inputs(i))));
    }
    // A period d < L divides L / p for some prime p of L, so x_0 != x_{L/p} for each such p leaves exact length L.
    for (const p of primeFactors(L)) {
      const d = L / p;
      solver.require(Logic.or(Array.from({ length: n }, (_, i) => Logic.xor(v(0, i), v(d, i)))));
    }
    for (;;) {
      if (shouldStop?.()) throw new CancelledError();
      if (cycles.length >= maxSolutions) return { cycles: sortCycles(cycles), complete: false };
      const solution = solver.solve();
      if (!solution) break;
      const map = solution.getMap();
      const states: string[] = [];
      for (let t = 0; t < L; t++) {
        let s = "";
        for (let i = 0; i < n; i++) s += map[v(t, i)] ? "1" : "0";
        states.push(s);
      }
      for (const s of states)
        solver.require(Logic.or(Array.from({ length: n }, (_, i) => (s[i] === "1" ? Logic.not(v(0, i)) : v(0, i)))));
      cycles.push({ length: L, states: rotateToSmallest(states, (a, b) => a < b) });
    }
  }
  onProgress?.(1, "done");
  return { cycles: sortCycles(cycles), complete: true };
}

/**
 * All fixed points (states equal to their synchronous successor), sorted by text. They go through the clause form of
 * x <-> F(x) (fixed-point-clauses.ts) rather than the formula layer: on 1,000-node networks that is many times faster.
 */
export function satFixedPoints(net: BooleanNetwork, options: SatOptions = {}): { states: string[]; complete: boolean } {
  const states: string[] = [];
  options.onProgress?.(0, "fixed points");
  const complete = forEachFixedPoint(
    net,
    options.maxSolutions ?? 10_000,
    (state) => states.push(bytesToString(state)),
    options.shouldStop,
  );
  options.onProgress?.(1, "done");
  return { states: states.sort(), complete };
}

function sortCycles(cycles: SatCycle[]): SatCycle[] {
  return cycles.sort(
    (a, b) => a.length - b.length || (a.states[0]! < b.states[0]! ? -1 : a.states[0]! > b.states[0]! ? 1 : 0),
  );
}
