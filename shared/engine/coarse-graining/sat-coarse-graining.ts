// Coarse-graining onto observed nodes for sources too large to tabulate, decided by SAT. The observed nodes O close
// at time t exactly when no two states agree on O while their images under F^t differ on O. Only the cone of O (the
// nodes that reach O within t steps, layer by layer) enters the encoding: two copies of the unrolled cone, equal on O
// at time 0, with at least one observed node different at time t (the unrolling of bounded model checking: Biere,
// Cimatti, Clarke, Zhu, "Symbolic model checking without BDDs", TACAS 1999). UNSAT proves closure; a model is a
// counterexample. When O closes, the image of any state with observed values a gives G(a), so G is read off by
// simulating one state per assignment of O. Results match coarseGrain's closing case: same target, same names.
import { CancelledError, EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import { networkFromSuccessors } from "../emulation";
import { ClauseSolver, requireNodeFunction } from "../sat";
import type { CoarseGrainingControl } from "./coarse-graining";

/** Largest source accepted. */
export const MAX_SAT_COARSE_GRAINING_NODES = 10_000;
/** Largest time scale unrolled. */
export const MAX_SAT_COARSE_GRAINING_TIME = 8;
/** Most observed nodes (the target is tabulated on 2^m states). */
export const MAX_SAT_OBSERVED_NODES = 16;

export interface ClosureCounterexample {
  /** Two source states (node-ordered 0/1 text) with the same observed values. */
  readonly states: [string, string];
  /** Their images under F^t, which differ on at least one observed node. */
  readonly images: [string, string];
  /** Observed nodes on which the images differ. */
  readonly differingNodes: string[];
}

export interface SatCoarseGrainingResult {
  readonly time: number;
  /** Observed node names, in the order of the target's nodes. */
  readonly observed: string[];
  readonly closes: boolean;
  /** The network on the observed nodes when they close (node k is observed node k). */
  readonly target: BooleanNetwork | null;
  readonly counterexample: ClosureCounterexample | null;
  /** Number of source nodes that can influence the observed ones within t steps (the size of the encoding). */
  readonly coneNodes: number;
}

/** Do the observed source nodes predict themselves t steps ahead? Decided by SAT, for sources of any size. */
export function coarseGrainBySat(
  source: BooleanNetwork,
  observedNodes: readonly number[],
  time: number,
  control: CoarseGrainingControl = {},
): SatCoarseGrainingResult {
  const n = source.names.length;
  const m = observedNodes.length;
  if (n > MAX_SAT_COARSE_GRAINING_NODES)
    throw new EngineError(
      "TOO_LARGE",
      `coarse-graining by SAT supports at most ${MAX_SAT_COARSE_GRAINING_NODES} source nodes`,
    );
  if (m < 1) throw new EngineError("BAD_OBSERVABLE", "at least one observed node is needed");
  if (m > MAX_SAT_OBSERVED_NODES)
    throw new EngineError("TOO_LARGE", `at most ${MAX_SAT_OBSERVED_NODES} observed nodes are supported`);
  if (!(Number.isInteger(time) && time >= 1 && time <= MAX_SAT_COARSE_GRAINING_TIME))
    throw new EngineError("BAD_ARGUMENT", `the time scale must be an integer 1..${MAX_SAT_COARSE_GRAINING_TIME}`);
  for (const o of observedNodes)
    if (!(Number.isInteger(o) && o >= 0 && o < n))
      throw new EngineError("BAD_OBSERVABLE", `node ${o} is not a source node`);
  if (new Set(observedNodes).size !== m) throw new EngineError("BAD_OBSERVABLE", "a node is observed twice");
  const { onProgress, shouldStop } = control;
  onProgress?.(0, "encoding the cone of the observed nodes");

  // layers[s]: nodes whose value at step s matters; layer t is O, layer s-1 the regulators of layer s, and layer 0
  // also holds O (the two states must agree there).
  const layers: number[][] = new Array(time + 1);
  layers[time] = [...observedNodes];
  for (let s = time - 1; s >= 0; s--) {
    const set = new Set<number>();
    for (const i of layers[s + 1]!) for (const r of source.regulators[i]!) set.add(r);
    if (s === 0) for (const o of observedNodes) set.add(o);
    layers[s] = [...set].sort((a, b) => a - b);
  }
  const cone = new Set(layers.flat());

  const solver = new ClauseSolver();
  const copies = [0, 1].map(() => layers.map((layer) => new Map(layer.map((i) => [i, solver.newVar()] as const))));
  for (const copy of copies)
    for (let s = 1; s <= time; s++)
      for (const i of layers[s]!) {
        const prev = copy[s - 1]!;
        requireNodeFunction(
          solver,
          source.tables[i]!,
          Array.from(source.regulators[i]!, (r) => prev.get(r)!),
          copy[s]!.get(i)!,
        );
      }
  const [a, b] = copies as [Map<number, number>[], Map<number, number>[]];
  for (const o of observedNodes) {
    solver.clause([-a[0]!.get(o)!, b[0]!.get(o)!]);
    solver.clause([a[0]!.get(o)!, -b[0]!.get(o)!]);
  }
  const differs = observedNodes.map((o) => {
    const d = solver.newVar();
    const x = a[time]!.get(o)!;
    const y = b[time]!.get(o)!;
    solver.clause([-d, x, y]);
    solver.clause([-d, -x, -y]);
    return d;
  });
  solver.clause(differs);
  if (shouldStop?.()) throw new CancelledError();
  onProgress?.(0.2, "searching for two states that the observed nodes cannot tell apart");
  const solution = solver.solve();
  const observed = observedNodes.map((o) => source.names[o]!);

  if (solution) {
    const states = [a, b].map((copy) => {
      const state = new Uint8Array(n);
      for (const [i, v] of copy[0]!) state[i] = solution[v] ? 1 : 0;
      return state;
    });
    const images = states.map((s) => iterate(source, s, time, layers));
    const differingNodes = observedNodes.filter((o) => images[0]![o] !== images[1]![o]).map((o) => source.names[o]!);
    // The simulation re-checks the solver's answer; a disagreement would be a bug in the encoding.
    if (differingNodes.length === 0) throw new EngineError("INTERNAL", "the SAT counterexample does not reproduce");
    onProgress?.(1, "done");
    return {
      time,
      observed,
      closes: false,
      target: null,
      counterexample: {
        states: [toText(states[0]!), toText(states[1]!)],
        images: [toText(fullImage(source, states[0]!, time)), toText(fullImage(source, states[1]!, time))],
        differingNodes,
      },
      coneNodes: cone.size,
    };
  }

  onProgress?.(0.6, "reading off the coarse-grained network");
  const succ = new Uint32Array(2 ** m);
  const state = new Uint8Array(n);
  for (let label = 0; label < succ.length; label++) {
    if ((label & 0xff) === 0 && shouldStop?.()) throw new CancelledError();
    observedNodes.forEach((o, k) => (state[o] = (label >> k) & 1));
    const image = iterate(source, state, time, layers);
    let y = 0;
    observedNodes.forEach((o, k) => (y |= image[o]! << k));
    succ[label] = y >>> 0;
  }
  onProgress?.(1, "done");
  return {
    time,
    observed,
    closes: true,
    target: networkFromSuccessors(observed, succ),
    counterexample: null,
    coneNodes: cone.size,
  };
}

/** F^t of a state on the cone only: step s computes the nodes of layer s from those of layer s-1. */
function iterate(net: BooleanNetwork, start: Uint8Array, time: number, layers: number[][]): Uint8Array {
  let current = Uint8Array.from(start);
  for (let s = 1; s <= time; s++) {
    const next = new Uint8Array(current.length);
    for (const i of layers[s]!) next[i] = value(net, i, current);
    current = next;
  }
  return current;
}

/** F^t of a whole state (for reporting the counterexample's images in full). */
function fullImage(net: BooleanNetwork, start: Uint8Array, time: number): Uint8Array {
  let current = start;
  for (let s = 0; s < time; s++) {
    const next = new Uint8Array(current.length);
    for (let i = 0; i < current.length; i++) next[i] = value(net, i, current);
    current = next;
  }
  return current;
}

function value(net: BooleanNetwork, i: number, state: Uint8Array): number {
  const regs = net.regulators[i]!;
  let row = 0;
  for (let j = 0; j < regs.length; j++) row |= state[regs[j]!]! << j;
  return net.tables[i]![row]!;
}

function toText(state: Uint8Array): string {
  let s = "";
  for (let i = 0; i < state.length; i++) s += state[i] ? "1" : "0";
  return s;
}
