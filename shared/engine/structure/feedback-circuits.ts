// Elementary feedback circuits up to a given length in the essential interaction graph, with their sign (the
// product of edge signs; Thomas, "On the relation between the logical structure of systems and their ability to
// generate multiple steady states or sustained oscillations", Springer Series in Synergetics 1981). Without an
// effective length bound this is Johnson, "Finding all the elementary circuits of a directed graph", SIAM J.
// Computing 1975; with a bound, Johnson's blocking would lose circuits, so the same start-vertex decomposition
// prunes instead every vertex farther from the start than the remaining length.
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

  const blocked = new Uint8Array(n);
  const blockedBy: Set<number>[] = Array.from({ length: n }, () => new Set());
  const unblock = (u: number): void => {
    blocked[u] = 0;
    for (const w of blockedBy[u]!) {
      blockedBy[u]!.delete(w);
      if (blocked[w]) unblock(w);
    }
  };

  for (let start = 0; start < n && circuits.length < maxCircuits; start++) {
    if (maxLength >= n) {
      // Johnson: a vertex stays blocked while every path from it back to the start is known to meet the path.
      for (let v = start; v < n; v++) ((blocked[v] = 0), blockedBy[v]!.clear());
      const circuit = (v: number): boolean => {
        let closed = false;
        path.push(v);
        blocked[v] = 1;
        for (const w of out[v]!) {
          if (w < start || circuits.length >= maxCircuits) continue;
          if (w === start) {
            record();
            closed = true;
          } else if (!blocked[w] && circuit(w)) closed = true;
        }
        if (closed) unblock(v);
        else for (const w of out[v]!) if (w >= start) blockedBy[w]!.add(v);
        path.pop();
        return closed;
      };
      circuit(start);
      continue;
    }
    // Steps from each vertex >= start back to start, inside the subgraph of vertices >= start.
    distance.fill(-1);
    distance[start] = 0;
    const queue = [start];
    for (let h = 0; h < queue.length; h++) {
      const v = queue[h]!;
      for (const u of into[v]!) if (u > start && distance[u] === -1) ((distance[u] = distance[v]! + 1), queue.push(u));
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
