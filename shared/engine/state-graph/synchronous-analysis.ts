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
  /** Longest number of steps from a state to its first attractor state (0 when every state is on an attractor). */
  maxTransient: number;
  meanTransient: number;
}

// One 32-bit word per state holds both what the walk knows about it and its transient length, so the analysis needs
// two arrays of 2^n words (successors and this) and not three: at n = 24 that is 128 MB instead of 192 MB. The low
// 25 bits hold 0 (unvisited), ON_PATH, or the 1-based attractor id (at most 2^24); the high 7 bits the transient
// length, or DEEP when it is at least DEEP, in which case a full-width array allocated on first need holds it.
const ID_BITS = 25;
const ID_MASK = (1 << ID_BITS) - 1;
const ON_PATH = ID_MASK;
const DEEP = 127;

/** Exact synchronous analysis of a network of up to 24 nodes. */
export function analyseSynchronous(net: BooleanNetwork, options: LongTaskOptions = {}): SynchronousAnalysis {
  const n = net.names.length;
  const { onProgress, shouldStop } = options;
  const succ = successorTable(net, {
    onProgress: onProgress && ((f, phase) => onProgress(f * 0.5, phase)),
    shouldStop,
  });
  const N = succ.length;
  const word = new Uint32Array(N);
  let deep: Uint32Array | null = null;
  const depthOf = (x: number) => {
    const d = word[x]! >>> ID_BITS;
    return d < DEEP ? d : deep![x]!;
  };
  const settle = (x: number, a: number, d: number) => {
    if (d < DEEP) word[x] = (a | (d << ID_BITS)) >>> 0;
    else {
      deep ??= new Uint32Array(N);
      deep[x] = d;
      word[x] = (a | (DEEP << ID_BITS)) >>> 0;
    }
  };
  const cycleEntry: number[] = [];
  const cycleLengths: number[] = [];
  let maxTransient = 0;
  let sumTransient = 0;
  for (let start = 0; start < N; start++) {
    if ((start & 0xffff) === 0 && start > 0) {
      if (shouldStop?.()) throw new CancelledError();
      onProgress?.(0.5 + (0.5 * start) / N, "attractors");
    }
    if (word[start] !== 0) continue;
    // Every earlier walk is settled before the next starts, so one ON_PATH mark tells this walk's states apart.
    let x = start;
    let pathLength = 0;
    while (word[x] === 0) {
      word[x] = ON_PATH;
      pathLength++;
      x = succ[x]!;
    }
    let a: number;
    let firstDepth: number;
    if (word[x] === ON_PATH) {
      // A new cycle closes at x.
      cycleEntry.push(x);
      a = cycleEntry.length;
      let cycleLength = 0;
      let y = x;
      do {
        word[y] = a;
        cycleLength++;
        y = succ[y]!;
      } while (y !== x);
      cycleLengths.push(cycleLength);
      firstDepth = pathLength - cycleLength;
    } else {
      a = word[x]! & ID_MASK;
      firstDepth = pathLength + depthOf(x);
    }
    if (firstDepth > maxTransient) maxTransient = firstDepth;
    let d = firstDepth;
    for (let y = start; word[y] === ON_PATH; y = succ[y]!) {
      sumTransient += d;
      settle(y, a, d--);
    }
  }

  const basin = new Float64Array(cycleEntry.length + 1);
  for (let s = 0; s < N; s++) basin[word[s]! & ID_MASK]!++;
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
  // The same memory becomes attractorOf: attractor indices are below 2^24, so they read the same as Int32.
  for (let s = 0; s < N; s++) word[s] = remap[word[s]! & ID_MASK]!;
  onProgress?.(1, "attractors");
  return {
    nodeCount: n,
    stateCount: N,
    attractors: found.map((f) => f.attractor),
    successors: succ,
    attractorOf: new Int32Array(word.buffer, word.byteOffset, N),
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
