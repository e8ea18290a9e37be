// Trajectories from one initial state under the three classical update schemes: synchronous (all nodes at
// once), random-order asynchronous (each step updates every node once, in a fresh random order) and general
// asynchronous (each step updates one node chosen uniformly), as classified by Gershenson, "Classification of
// random Boolean networks", Artificial Life VIII, 2002.
import { EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import { nodeValue, synchronousStep } from "./node-value";

export type UpdateScheme = "synchronous" | "random-order" | "general-asynchronous";

export interface TrajectoryOptions {
  scheme: UpdateScheme;
  steps: number;
  /** Required for the asynchronous schemes: a seeded generator of numbers in [0, 1). */
  rng?: () => number;
  /** Stop as soon as a state repeats (under synchronous update the last state then closes the cycle). */
  stopAtRepeat?: boolean;
}

/** States visited from `initial` (included as the first row), one byte per node each. */
export function trajectory(net: BooleanNetwork, initial: Uint8Array, options: TrajectoryOptions): Uint8Array[] {
  const n = net.names.length;
  if (initial.length !== n)
    throw new EngineError("BAD_STATE", `the initial state has ${initial.length} values but the network has ${n} nodes`);
  const rows: Uint8Array[] = [Uint8Array.from(initial)];
  const { scheme, steps, rng } = options;
  if (scheme !== "synchronous" && !rng)
    throw new EngineError("NEED_SEED", `the ${scheme} scheme needs a seeded random generator`);
  const seen = new Set<string>();
  if (options.stopAtRepeat) seen.add(initial.join(""));
  const order = Int32Array.from({ length: n }, (_, i) => i);
  for (let step = 0; step < steps; step++) {
    const current = rows[rows.length - 1]!;
    let next: Uint8Array;
    if (scheme === "synchronous") {
      next = synchronousStep(net, current);
    } else if (scheme === "random-order") {
      next = Uint8Array.from(current);
      for (let i = n - 1; i > 0; i--) {
        const j = Math.floor(rng!() * (i + 1));
        const t = order[i]!;
        order[i] = order[j]!;
        order[j] = t;
      }
      for (let q = 0; q < n; q++) next[order[q]!] = nodeValue(net, order[q]!, next);
    } else {
      next = Uint8Array.from(current);
      if (n > 0) {
        const i = Math.floor(rng!() * n);
        next[i] = nodeValue(net, i, current);
      }
    }
    rows.push(next);
    if (options.stopAtRepeat) {
      const key = next.join("");
      if (seen.has(key)) break;
      seen.add(key);
    }
  }
  return rows;
}
