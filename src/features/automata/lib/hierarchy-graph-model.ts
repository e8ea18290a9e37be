// What the hierarchy graph draws: the relation restricted to a block-size range, optionally on symmetry classes,
// with mutually emulating nodes merged and only the edges no other path implies (the transitive reduction), so
// that a relation of thousands of pairs stays readable.
import type { HierarchyPair } from "@shared/schemas/automata";

export interface GraphFilters {
  minBlock: number;
  maxBlock: number;
  bySymmetryClass: boolean;
}

export interface GraphNode {
  id: string;
  label: string;
  /** Every rule the node stands for (a symmetry class, or rules that emulate each other, or both). */
  rules: number[];
  /** Longest chain of emulators above the node; emulators of nothing drawn are at layer 0. */
  layer: number;
}

export interface GraphEdge {
  source: string;
  target: string;
  /** Least block size of a pair between the two nodes' rules. */
  minBlock: number;
  /** One pair realising that block size, for the link to its witness. */
  pair: { source: number; target: number };
}

export interface HierarchyGraphModel {
  nodes: GraphNode[];
  edges: GraphEdge[];
  /** Units with no pair in range, left out of the drawing. */
  isolated: number;
  /** Pairs in range before the reduction (self pairs excluded). */
  pairsInRange: number;
}

interface UnitEdge {
  minBlock: number;
  pair: { source: number; target: number };
}

export function buildHierarchyGraph(
  pairs: readonly HierarchyPair[],
  symmetryClasses: readonly number[][],
  filters: GraphFilters,
): HierarchyGraphModel {
  const unitOf = new Int32Array(256);
  const unitRules: number[][] = [];
  const unitLabels: string[] = [];
  if (filters.bySymmetryClass) {
    symmetryClasses.forEach((members, i) => {
      for (const r of members) unitOf[r] = i;
      unitRules.push([...members]);
      unitLabels.push(String(members[0]));
    });
  } else {
    for (let r = 0; r < 256; r++) {
      unitOf[r] = r;
      unitRules.push([r]);
      unitLabels.push(String(r));
    }
  }
  const n = unitRules.length;
  const adjacency = new Map<number, Map<number, UnitEdge>>();
  let pairsInRange = 0;
  for (const p of pairs) {
    // composed pairs are implied by the chains they compose, so they never survive the reduction
    if (p.composed || p.source === p.target || p.minBlock < filters.minBlock || p.minBlock > filters.maxBlock) continue;
    pairsInRange++;
    const u = unitOf[p.source]!;
    const v = unitOf[p.target]!;
    if (u === v) continue;
    let out = adjacency.get(u);
    if (!out) adjacency.set(u, (out = new Map()));
    const prev = out.get(v);
    if (!prev || p.minBlock < prev.minBlock)
      out.set(v, { minBlock: p.minBlock, pair: { source: p.source, target: p.target } });
  }

  const component = stronglyConnectedComponents(n, (u) => adjacency.get(u)?.keys() ?? []);
  const componentCount = Math.max(0, ...component) + 1;
  const members: number[][] = Array.from({ length: componentCount }, () => []);
  for (let u = 0; u < n; u++) members[component[u]!]!.push(u);

  // the condensation: one edge per pair of components, with the least block size among the pairs between them
  const dag = new Map<number, Map<number, UnitEdge>>();
  for (const [u, out] of adjacency) {
    for (const [v, e] of out) {
      const cu = component[u]!,
        cv = component[v]!;
      if (cu === cv) continue;
      let row = dag.get(cu);
      if (!row) dag.set(cu, (row = new Map()));
      const prev = row.get(cv);
      if (!prev || e.minBlock < prev.minBlock) row.set(cv, e);
    }
  }

  const order = topologicalOrder(componentCount, (c) => dag.get(c)?.keys() ?? []);
  const words = Math.ceil(componentCount / 32);
  const reach = Array.from({ length: componentCount }, () => new Uint32Array(words));
  for (let i = order.length - 1; i >= 0; i--) {
    const c = order[i]!;
    const r = reach[c]!;
    for (const w of dag.get(c)?.keys() ?? []) {
      r[w >>> 5]! |= 1 << (w & 31);
      const rw = reach[w]!;
      for (let j = 0; j < words; j++) r[j]! |= rw[j]!;
    }
  }
  const edges: { from: number; to: number; e: UnitEdge }[] = [];
  for (const [c, row] of dag) {
    for (const [v, e] of row) {
      let implied = false;
      for (const w of row.keys()) {
        if (w !== v && (reach[w]![v >>> 5]! >>> (v & 31)) & 1) {
          implied = true;
          break;
        }
      }
      if (!implied) edges.push({ from: c, to: v, e });
    }
  }

  const layer = new Int32Array(componentCount);
  for (const c of order) for (const v of dag.get(c)?.keys() ?? []) layer[v] = Math.max(layer[v]!, layer[c]! + 1);
  const touched = new Uint8Array(componentCount);
  for (const { from, to } of edges) touched[from] = touched[to] = 1;
  // rules that emulate each other are drawn even when nothing else relates to them
  for (let c = 0; c < componentCount; c++) if (members[c]!.length > 1) touched[c] = 1;

  const nodes: GraphNode[] = [];
  let isolated = 0;
  for (let c = 0; c < componentCount; c++) {
    if (!touched[c]) {
      isolated += members[c]!.length;
      continue;
    }
    const units = members[c]!.sort((a, b) => unitRules[a]![0]! - unitRules[b]![0]!);
    nodes.push({
      id: `n${unitRules[units[0]!]![0]}`,
      label: units.map((u) => unitLabels[u]).join(" ≡ "),
      rules: units.flatMap((u) => unitRules[u]!).sort((a, b) => a - b),
      layer: layer[c]!,
    });
  }
  nodes.sort((a, b) => a.rules[0]! - b.rules[0]!);
  const idOf = (c: number) => `n${unitRules[members[c]![0]!]![0]}`;
  return {
    nodes,
    edges: edges.map(({ from, to, e }) => ({
      source: idOf(from),
      target: idOf(to),
      minBlock: e.minBlock,
      pair: e.pair,
    })),
    isolated,
    pairsInRange,
  };
}

/** Tarjan's algorithm, iterative; returns each vertex's component number. */
function stronglyConnectedComponents(n: number, successors: (u: number) => Iterable<number>): Int32Array {
  const index = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  const onStack = new Uint8Array(n);
  const component = new Int32Array(n).fill(-1);
  const stack: number[] = [];
  let counter = 0;
  let components = 0;
  for (let root = 0; root < n; root++) {
    if (index[root] !== -1) continue;
    const work: { u: number; it: Iterator<number> }[] = [{ u: root, it: successors(root)[Symbol.iterator]() }];
    index[root] = low[root] = counter++;
    stack.push(root);
    onStack[root] = 1;
    while (work.length) {
      const top = work[work.length - 1]!;
      const next = top.it.next();
      if (!next.done) {
        const v = next.value;
        if (index[v] === -1) {
          index[v] = low[v] = counter++;
          stack.push(v);
          onStack[v] = 1;
          work.push({ u: v, it: successors(v)[Symbol.iterator]() });
        } else if (onStack[v]) low[top.u] = Math.min(low[top.u]!, index[v]!);
        continue;
      }
      work.pop();
      const u = top.u;
      if (work.length) low[work[work.length - 1]!.u] = Math.min(low[work[work.length - 1]!.u]!, low[u]!);
      if (low[u] === index[u]) {
        let w: number;
        do {
          w = stack.pop()!;
          onStack[w] = 0;
          component[w] = components;
        } while (w !== u);
        components++;
      }
    }
  }
  return component;
}

/** Kahn's algorithm on an acyclic graph. */
function topologicalOrder(n: number, successors: (u: number) => Iterable<number>): number[] {
  const indegree = new Int32Array(n);
  for (let u = 0; u < n; u++) for (const v of successors(u)) indegree[v]!++;
  const queue: number[] = [];
  for (let u = 0; u < n; u++) if (indegree[u] === 0) queue.push(u);
  for (let i = 0; i < queue.length; i++) for (const v of successors(queue[i]!)) if (--indegree[v]! === 0) queue.push(v);
  return queue;
}
