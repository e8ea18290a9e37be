// Exact attractors under general asynchronous update: the terminal strongly connected components of the
// asynchronous state transition graph, where each successor of a state flips one node whose function disagrees
// with its current value (Thomas, "Regulatory networks seen as asynchronous automata: a logical description",
// J. Theor. Biol. 1991), found with an iterative form of Tarjan's algorithm (SIAM J. Computing, 1972).
import { compareStateIndices } from "../bits";
import { CancelledError, EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import { successorTable, type LongTaskOptions } from "../update";

export const MAX_ASYNC_NODES = 22;

export interface AsynchronousAttractor {
  /** Number of states in the terminal component (1 for a fixed point). */
  size: number;
  /** States of the component as indices, in the order of their node-ordered 0/1 text. */
  states: Uint32Array;
}

export interface AsynchronousAnalysis {
  nodeCount: number;
  /** Sorted by size descending, then by the text of the first state. */
  attractors: AsynchronousAttractor[];
  /** Number of strongly connected components of the whole graph (terminal or not). */
  componentCount: number;
}

export function asynchronousAttractors(net: BooleanNetwork, options: LongTaskOptions = {}): AsynchronousAnalysis {
  const n = net.names.length;
  if (n > MAX_ASYNC_NODES)
    throw new EngineError(
      "TOO_LARGE",
      `exact asynchronous analysis supports at most ${MAX_ASYNC_NODES} nodes; this network has ${n}`,
    );
  const { onProgress, shouldStop } = options;
  // The synchronous image tells, for each state, which nodes disagree with their function: those are the flips.
  const image = successorTable(net, { shouldStop });
  const N = image.length;
  const index = new Int32Array(N); // 0 = unvisited, else 1-based discovery order
  const low = new Int32Array(N);
  const component = new Int32Array(N).fill(-1);
  const stack = new Uint32Array(N);
  const callState = new Uint32Array(N);
  const callMask = new Uint32Array(N);
  let sp = 0;
  let cp = 0;
  let counter = 0;
  let components = 0;
  const attractors: AsynchronousAttractor[] = [];

  for (let root = 0; root < N; root++) {
    if (index[root] !== 0) continue;
    index[root] = low[root] = ++counter;
    stack[sp++] = root;
    callState[cp] = root;
    callMask[cp++] = (image[root]! ^ root) >>> 0;
    while (cp > 0) {
      const v = callState[cp - 1]!;
      const m = callMask[cp - 1]!;
      if (m !== 0) {
        const bit = (m & -m) >>> 0;
        callMask[cp - 1] = (m ^ bit) >>> 0;
        const w = (v ^ bit) >>> 0;
        if (index[w] === 0) {
          index[w] = low[w] = ++counter;
          if ((counter & 0xffff) === 0) {
            if (shouldStop?.()) throw new CancelledError();
            onProgress?.(counter / N, "asynchronous components");
          }
          stack[sp++] = w;
          callState[cp] = w;
          callMask[cp++] = (image[w]! ^ w) >>> 0;
        } else if (component[w] === -1 && index[w]! < low[v]!) {
          low[v] = index[w]!;
        }
        continue;
      }
      cp--;
      if (low[v] === index[v]) {
        const id = components++;
        let bottom = sp;
        do bottom--;
        while (stack[bottom] !== v);
        for (let q = bottom; q < sp; q++) component[stack[q]!] = id;
        let terminal = true;
        for (let q = bottom; q < sp && terminal; q++) {
          const s = stack[q]!;
          let flips = (image[s]! ^ s) >>> 0;
          while (flips !== 0) {
            const bit = (flips & -flips) >>> 0;
            if (component[(s ^ bit) >>> 0] !== id) {
              terminal = false;
              break;
            }
            flips = (flips ^ bit) >>> 0;
          }
        }
        if (terminal) {
          const states = stack.slice(bottom, sp).sort((a, b) => compareStateIndices(a, b, n));
          attractors.push({ size: states.length, states });
        }
        sp = bottom;
      }
      if (cp > 0) {
        const u = callState[cp - 1]!;
        if (low[v]! < low[u]!) low[u] = low[v]!;
      }
    }
  }
  attractors.sort((a, b) => b.size - a.size || compareStateIndices(a.states[0]!, b.states[0]!, n));
  onProgress?.(1, "asynchronous components");
  return { nodeCount: n, attractors, componentCount: components };
}
