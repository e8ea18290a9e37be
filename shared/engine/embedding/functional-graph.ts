// The state transition graph of a deterministic map as a functional graph: cycles (attractors) with in-trees of
// transient states hanging off each cycle state; in-trees get canonical shape ids (Aho, Hopcroft, Ullman,
// "The Design and Analysis of Computer Algorithms", Addison-Wesley, 1974, tree isomorphism) shared across graphs.

export interface FunctionalGraph {
  readonly succ: ArrayLike<number>;
  readonly onCycle: Uint8Array;
  /** Cycles as state lists c, succ(c), succ(succ(c)), ... */
  readonly cycles: Uint32Array[];
  /** Transient preimages of each state (CSR): children of s are children[childStart[s] .. childStart[s+1]). */
  readonly childStart: Int32Array;
  readonly children: Uint32Array;
  /** Shape id of the in-tree rooted at each state (transient preimages only), from the shared registry. */
  readonly shape: Int32Array;
}

/** Shapes of rooted trees, shared by the graphs being compared so equal ids mean isomorphic trees. */
export class ShapeRegistry {
  private readonly ids = new Map<string, number>();
  /** Sorted child shape ids of each shape. */
  readonly childShapes: Int32Array[] = [];
  readonly size: number[] = [];
  readonly height: number[] = [];

  idOf(childIds: Int32Array): number {
    const key = childIds.join(",");
    let id = this.ids.get(key);
    if (id === undefined) {
      id = this.childShapes.length;
      this.ids.set(key, id);
      this.childShapes.push(childIds);
      let size = 1;
      let height = 0;
      for (const c of childIds) {
        size += this.size[c]!;
        height = Math.max(height, this.height[c]! + 1);
      }
      this.size.push(size);
      this.height.push(height);
    }
    return id;
  }
}

export function functionalGraph(succ: ArrayLike<number>, registry: ShapeRegistry): FunctionalGraph {
  const N = succ.length;
  // Cycle states are those left after repeatedly peeling states of in-degree zero.
  const indeg = new Int32Array(N);
  for (let x = 0; x < N; x++) indeg[succ[x]!]!++;
  const childStart = new Int32Array(N + 1);
  const queue = new Uint32Array(N);
  let head = 0;
  let tail = 0;
  for (let x = 0; x < N; x++) if (indeg[x] === 0) queue[tail++] = x;
  const remaining = Int32Array.from(indeg);
  while (head < tail) {
    const x = queue[head++]!;
    const y = succ[x]!;
    if (--remaining[y]! === 0) queue[tail++] = y;
  }
  // queue[0..tail) now lists transient states with every child before its parent.
  const onCycle = new Uint8Array(N).fill(1);
  for (let i = 0; i < tail; i++) onCycle[queue[i]!] = 0;
  for (let i = 0; i < tail; i++) childStart[succ[queue[i]!]! + 1]!++;
  for (let x = 0; x < N; x++) childStart[x + 1]! += childStart[x]!;
  const fill = childStart.slice(0, N);
  const children = new Uint32Array(tail);
  for (let i = 0; i < tail; i++) {
    const x = queue[i]!;
    children[fill[succ[x]!]!++] = x;
  }
  const shape = new Int32Array(N).fill(-1);
  const shapeOf = (x: number) => {
    const ids = new Int32Array(childStart[x + 1]! - childStart[x]!);
    for (let k = childStart[x]!; k < childStart[x + 1]!; k++) ids[k - childStart[x]!] = shape[children[k]!]!;
    ids.sort();
    return registry.idOf(ids);
  };
  for (let i = 0; i < tail; i++) shape[queue[i]!] = shapeOf(queue[i]!);
  const cycles: Uint32Array[] = [];
  const seen = new Uint8Array(N);
  for (let x = 0; x < N; x++) {
    if (!onCycle[x] || seen[x]) continue;
    const cyc: number[] = [];
    for (let y = x; !seen[y]; y = succ[y]!) {
      seen[y] = 1;
      cyc.push(y);
      shape[y] = shapeOf(y);
    }
    cycles.push(Uint32Array.from(cyc));
  }
  return { succ, onCycle, cycles, childStart, children, shape };
}
