// Elementary feedback circuits up to a given length in the essential interaction graph, with their sign (the
// product of edge signs; Thomas, "On the relation between the logical structure of systems and their ability to
// generate multiple steady states or sustained oscillations", Springer Series in Synergetics 1981). Enumeration
// follows the start-vertex decomposition of Johnson, "Finding all the elementary circuits of a directed graph",
// SIAM J. Computing 1975; with a length bound, Johnson's blocking is replaced by pruning vertices farther from
// the start than the remaining length, which keeps every extension of a path able to close a circuit.
import type { BooleanNetwork } from "../network";
import { interactionGraph, type EdgeSign } from "./interaction-graph";

export interface FeedbackCircuit {
  /** Nodes in order along the circuit, starting at the smallest index; the last node regulates the first. */
  nodes: number[];
  sign: "positive" | "negative" | "dual";
}

export interface CircuitSearch {
  circuits: FeedbackCircuit[];
  /** False when maxCircuits stopped the enumeration early. */
  complete: boolean;
}

export function feedbackCircuits(net: BooleanNetwork, maxLength: number, maxCircuits = 100_000): CircuitSearch {
  const n = net.names.length;
  if (maxLength < 1) return { circuits: [], complete: true };
  const out: number[][] = Array.from({ length: n }, () => []);
  const signOf = new Map<number, EdgeSign>();
  for (const e of interactionGraph(net).edges) {
    if (e.sign === "non-essential") continue;
    out[e.source]!.push(e.target);
    signOf.set(e.source * n + e.target, e.sign);
  }
  const into: number[][] = Array.from({ length: n }, () => []);
  out.forEach((targets, s) => targets.forEach((t) => into[t]!.push(s)));
  const circuits: FeedbackCircuit[] = [];
  const distance = new Int32Array(n);
  const onPath = new Uint8Array(n);
  const path: number[] = [];

  const record = () => {
    let negatives = 0;
    let dual = false;
    for (let q = 0; q < path.length; q++) {
      const sign = signOf.get(path[q]! * n + path[(q + 1) % path.length]!)!;
      if (sign === "dual") dual = true;
      else if (sign === "negative") negatives++;
    }
    circuits.push({ nodes: [...path], sign: dual ? "dual" : negatives % 2 === 0 ? "positive" : "negative" });
  };

  for (let start = 0; start < n && circuits.length < maxCircuits; start++) {
    // Steps from each vertex >= start back to start, inside the subgraph of vertices >= start.
    distance.fill(-1);
    distance[start] = 0;
    const queue = [start];
    for (let h = 0; h < queue.length; h++) {
      const v = queue[h]!;
      for (const u of into[v]!) if (u > start && distance[u] === -1) (distance[u] = distance[v]! + 1), queue.push(u);
    }
    const extend = (v: number): void => {
      for (const w of out[v]!) {
        if (circuits.length >= maxCircuits) return;
        if (w === start) {
          record();
          continue;
        }
        if (w < start || onPath[w] || distance[w] === -1 || path.length + distance[w]! > maxLength) continue;
        onPath[w] = 1;
        path.push(w);
        extend(w);
        path.pop();
        onPath[w] = 0;
      }
    };
    path.push(start);
    onPath[start] = 1;
    extend(start);
    onPath[start] = 0;
    path.pop();
  }
  return { circuits, complete: circuits.length < maxCircuits };
}
