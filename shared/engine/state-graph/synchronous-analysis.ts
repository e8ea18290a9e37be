// Exact analysis of the synchronous state transition graph (a functional graph: one successor per state) for up
// to 24 nodes: every attractor, basin sizes and transient lengths, in time linear in 2^n, as in the state-space
// view of Kauffman, "Metabolic stability and epigenesis in randomly constructed genetic nets", J. Theor. Biol. 1969.
import { compareStateIndices } from "../bits";
import { CancelledError } from "../errors";
import type { BooleanNetwork } from "../network";
import { successorTable, type LongTaskOptions } from "../update";

export interface SynchronousAttractor {
  /** Number of states on the cycle (1 for a fixed point). */
  length: number;
  /** Number of states whose trajectory ends on this attractor (the attractor's own states included). */
  basin: number;
  /** Cycle states as indices, starting at the textually smallest state and following the dynamics. */
  states: Uint32Array;
}

export interface SynchronousAnalysis {
  nodeCount: number;
  stateCount: number;
  /** Sorted by basin descending, then by the text of the first state. */
  attractors: SynchronousAttractor[];
  successors: Uint32Array;
  /** attractorOf[s] = index in `attractors` of the attractor state s ends on. */
  attractorOf: Int32Array;
  /** transient[s] = steps from s to its first attractor state (0 on attractors). */
  transient: Uint32Array;
  maxTransient: number;
  meanTransient: number;
}

/** Exact synchronous analysis of a network of up to 24 nodes. */
export function analyseSynchronous(net: BooleanNetwork, options: LongTaskOptions = {}): SynchronousAnalysis {
  const n = net.names.length;
  const { onProgress, shouldStop } = options;
  const succ = successorTable(net, {
    onProgress: onProgress && ((f, phase) => onProgress(f * 0.5, phase)),
    shouldStop,
  });
  const N = succ.length;
  // label: 0 unvisited; -w while on the path of walk w; a > 0 once known to end on attractor a (1-based).
  const label = new Int32Array(N);
  const depth = new Uint32Array(N);
  const cycleEntry: number[] = [];
  const cycleLengths: number[] = [];
  let walk = 0;
  for (let start = 0; start < N; start++) {
    if ((start & 0xffff) === 0 && start > 0) {
      if (shouldStop?.()) throw new CancelledError();
      onProgress?.(0.5 + (0.5 * start) / N, "attractors");
    }
    if (label[start] !== 0) continue;
    walk++;
    const mark = -walk;
    let x = start;
    let pathLength = 0;
    while (label[x] === 0) {
      label[x] = mark;
      pathLength++;
      x = succ[x]!;
    }
    let a: number;
    let firstDepth: number;
    if (label[x] === mark) {
      // A new cycle closes at x.
      cycleEntry.push(x);
      a = cycleEntry.length;
      let cycleLength = 0;
      let y = x;
      do {
        label[y] = a;
        depth[y] = 0;
        cycleLength++;
        y = succ[y]!;
      } while (y !== x);
      cycleLengths.push(cycleLength);
      firstDepth = pathLength - cycleLength;
    } else {
      a = label[x]!;
      firstDepth = pathLength + depth[x]!;
    }
    let d = firstDepth;
    for (let y = start; label[y] === mark; y = succ[y]!) {
      label[y] = a;
      depth[y] = d--;
    }
  }

  const basin = new Float64Array(cycleEntry.length + 1);
  let maxTransient = 0;
  let sumTransient = 0;
  for (let s = 0; s < N; s++) {
    basin[label[s]!]!++;
    const d = depth[s]!;
    sumTransient += d;
    if (d > maxTransient) maxTransient = d;
  }
  const found = cycleEntry.map((entry, i) => {
    // Walk the cycle twice (find its smallest state, then list from there) so a long cycle is held only once.
    let smallest = entry;
    for (let y = succ[entry]!; y !== entry; y = succ[y]!) if (compareStateIndices(y, smallest, n) < 0) smallest = y;
    const states = new Uint32Array(cycleLengths[i]!);
    let y = smallest;
    for (let q = 0; q < states.length; q++) {
      states[q] = y;
      y = succ[y]!;
    }
    return { id: i + 1, attractor: { length: states.length, basin: basin[i + 1]!, states } };
  });
  found.sort(
    (p, q) =>
      q.attractor.basin - p.attractor.basin || compareStateIndices(p.attractor.states[0]!, q.attractor.states[0]!, n),
  );
  const remap = new Int32Array(cycleEntry.length + 1);
  found.forEach((f, index) => (remap[f.id] = index));
  for (let s = 0; s < N; s++) label[s] = remap[label[s]!]!;
  onProgress?.(1, "attractors");
  return {
    nodeCount: n,
    stateCount: N,
    attractors: found.map((f) => f.attractor),
    successors: succ,
    attractorOf: label,
    transient: depth,
    maxTransient,
    meanTransient: sumTransient / N,
  };
}

/** Call `visit` with every state of the basin of attractor `index` (in increasing index order). */
export function forEachBasinState(analysis: SynchronousAnalysis, index: number, visit: (state: number) => void): void {
  const of = analysis.attractorOf;
  for (let s = 0; s < of.length; s++) if (of[s] === index) visit(s);
}

/** The attractors with their states written as node-ordered 0/1 text. */
export function attractorsAsText(analysis: SynchronousAnalysis): { length: number; basin: number; states: string[] }[] {
  const n = analysis.nodeCount;
  return analysis.attractors.map((a) => ({
    length: a.length,
    basin: a.basin,
    states: Array.from(a.states, (s) => stateText(s, n)),
  }));
}

function stateText(state: number, n: number): string {
  let s = "";
  for (let i = 0; i < n; i++) s += (state >>> i) & 1 ? "1" : "0";
  return s;
}
