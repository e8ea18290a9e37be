// Coarse-graining of a Boolean network onto a smaller one: p(F^t(x)) = G(p(x)) for all x (Israeli, Goldenfeld,
// Physical Review E, 2006, carried to networks). When the observables do not close, the coarsest exact refinement is
// reported as a quotient map and written as a Boolean network on ceil(log2 groups) nodes.
//
// Rules for writing the quotient as a network: when the observables close, the target has one node per observable
// and labels that no source state shows stay fixed (their successors are unconstrained; listed in `unobservedLabels`).
// Otherwise group g gets the binary code g (groups numbered by smallest member state) and unused codes stay fixed.
import { EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import { networkFromSuccessors, successorsOfNetwork, transitionTable, MAX_TABULATED_NODES } from "../emulation";
import { coarsestCompatiblePartition } from "./coarsest-partition";
import { observeAll, type Observable } from "./observables";

export interface CoarseGrainingResult {
  readonly time: number;
  /** Do the observables alone predict themselves one step ahead? */
  readonly closes: boolean;
  /** The target on the observables when they close. */
  readonly target: BooleanNetwork | null;
  readonly unobservedLabels: number[];
  /** The coarsest compatible refinement of the observables. */
  readonly groups: number;
  readonly groupOf: Uint32Array;
  readonly groupSucc: Uint32Array;
  /** Observable values (bit k = observable k) shared by each group. */
  readonly groupLabel: Uint32Array;
  /** The quotient as a Boolean network (code of group g is g). */
  readonly quotient: BooleanNetwork;
}

export interface CoarseGrainingControl {
  readonly onProgress?: (fraction: number, phase: string) => void;
  readonly shouldStop?: () => boolean;
}

export function coarseGrain(
  source: BooleanNetwork,
  observables: readonly Observable[],
  time: number,
  control: CoarseGrainingControl = {},
): CoarseGrainingResult {
  const n = source.names.length;
  const m = observables.length;
  if (m < 1) throw new EngineError("BAD_OBSERVABLE", "at least one observable is needed");
  if (n > MAX_TABULATED_NODES)
    throw new EngineError("TOO_LARGE", `coarse-graining tabulates at most ${MAX_TABULATED_NODES} source nodes`);
  control.onProgress?.(0, "tabulating the source map");
  const succ = transitionTable(source, time);
  const labels = observeAll(n, observables);
  control.onProgress?.(0.4, "checking closure");
  const image = new Int32Array(2 ** m).fill(-1);
  let closes = true;
  for (let x = 0; x < succ.length && closes; x++) {
    const y = labels[x]!;
    const z = labels[succ[x]!]!;
    if (image[y] === -1) image[y] = z;
    else if (image[y] !== z) closes = false;
  }
  let target: BooleanNetwork | null = null;
  const unobservedLabels: number[] = [];
  if (closes) {
    const gSucc = new Uint32Array(2 ** m);
    for (let y = 0; y < gSucc.length; y++) {
      if (image[y] === -1) unobservedLabels.push(y);
      gSucc[y] = image[y] === -1 ? y : image[y]!;
    }
    target = networkFromSuccessors(uniqueNames(observables.map((o) => o.name)), gSucc);
  }
  control.onProgress?.(0.6, "refining the partition");
  const { groups, groupOf } = coarsestCompatiblePartition(succ, labels, control.shouldStop);
  const groupSucc = new Uint32Array(groups);
  const groupLabel = new Uint32Array(groups);
  for (let x = succ.length - 1; x >= 0; x--) {
    groupSucc[groupOf[x]!] = groupOf[succ[x]!]!;
    groupLabel[groupOf[x]!] = labels[x]!;
  }
  const bits = Math.max(1, Math.ceil(Math.log2(groups)));
  const codes = new Uint32Array(2 ** bits);
  for (let c = 0; c < codes.length; c++) codes[c] = c < groups ? groupSucc[c]! : c;
  const quotient = networkFromSuccessors(
    Array.from({ length: bits }, (_, i) => `q${i}`),
    codes,
  );
  control.onProgress?.(1, "refining the partition");
  return { time, closes, target, unobservedLabels, groups, groupOf, groupSucc, groupLabel, quotient };
}

/** Does F coarse-grain onto the given G through these observables at time t? (G has one node per observable.) */
export function coarseGrainsOnto(
  source: BooleanNetwork,
  target: BooleanNetwork,
  observables: readonly Observable[],
  time: number,
): boolean {
  if (target.names.length !== observables.length)
    throw new EngineError("BAD_OBSERVABLE", "the target needs one node per observable");
  const succ = transitionTable(source, time);
  const labels = observeAll(source.names.length, observables);
  const gSucc = successorsOfNetwork(target);
  for (let x = 0; x < succ.length; x++) if (labels[succ[x]!] !== gSucc[labels[x]!]) return false;
  return true;
}

function uniqueNames(names: string[]): string[] {
  const used = new Set<string>();
  return names.map((name) => {
    let out = name;
    while (used.has(out)) out += "'";
    used.add(out);
    return out;
  });
}
