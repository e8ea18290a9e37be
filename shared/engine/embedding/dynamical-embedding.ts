// Dynamical embedding: a one-to-one map e from G's states into F's states with F^t(e(x)) = e(G(x)). It exists exactly
// when G's functional graph embeds into that of F^t: each G cycle onto its own F^t cycle of the same length (some
// rotation), and each in-tree into the in-tree at the image of its root, children matched bipartitely (Hopcroft, Karp,
// "An n^5/2 algorithm for maximum matchings in bipartite graphs", SIAM J. Comput., 1973, for the matching step).
import { CancelledError, EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import { successorsOfNetwork, transitionTable } from "../emulation";
import { functionalGraph, ShapeRegistry } from "./functional-graph";

export interface EmbeddingResult {
  readonly found: boolean;
  readonly time: number;
  /** map[x] = e(x), the source state of target state x (null when no embedding exists). */
  readonly map: Uint32Array | null;
}

export interface EmbeddingControl {
  readonly onProgress?: (fraction: number, phase: string) => void;
  readonly shouldStop?: () => boolean;
}

/** Decide whether the map `targetSucc` embeds into the map `sourceSucc`; return the embedding or null. */
export function embedFunctionalGraph(
  sourceSucc: ArrayLike<number>,
  targetSucc: ArrayLike<number>,
  control: EmbeddingControl = {},
): Uint32Array | null {
  if (control.shouldStop?.()) throw new CancelledError();
  const registry = new ShapeRegistry();
  const F = functionalGraph(sourceSucc, registry);
  const G = functionalGraph(targetSucc, registry);
  if (targetSucc.length > sourceSucc.length) return null;
  const memo = new Map<number, boolean>();
  const SHIFT = 2 ** 26;
  let steps = 0;
  const tick = () => {
    if ((++steps & 4095) === 0 && control.shouldStop?.()) throw new CancelledError();
  };

  // Matching of a G node's child shapes into an F node's child shapes (with multiplicities).
  const matchShapes = (gChildren: ArrayLike<number>, fChildren: ArrayLike<number>): number[] | null => {
    const a = gChildren.length;
    if (a === 0) return [];
    if (a > fChildren.length) return null;
    const slots: number[] = [];
    const counts = new Map<number, number>();
    for (let i = 0; i < fChildren.length; i++) counts.set(fChildren[i]!, (counts.get(fChildren[i]!) ?? 0) + 1);
    for (const [s, c] of counts) for (let k = 0; k < Math.min(c, a); k++) slots.push(s);
    return bipartiteMatch(a, slots.length, (i, j) => embeds(gChildren[i]!, slots[j]!))?.map((j) => slots[j]!) ?? null;
  };
  const embeds = (g: number, f: number): boolean => {
    if (registry.size[g]! > registry.size[f]! || registry.height[g]! > registry.height[f]!) return false;
    if (registry.size[g] === 1) return true;
    const key = g * SHIFT + f;
    const known = memo.get(key);
    if (known !== undefined) return known;
    tick();
    const ok = matchShapes(registry.childShapes[g]!, registry.childShapes[f]!) !== null;
    memo.set(key, ok);
    return ok;
  };

  // Cycles of F^t grouped by length and by their root-shape sequence up to rotation.
  const wanted = new Set(G.cycles.map((c) => c.length));
  type CycleClass = { seq: number[]; cycles: Uint32Array[] };
  const classes = new Map<string, CycleClass>();
  for (const cyc of F.cycles) {
    if (!wanted.has(cyc.length)) continue;
    const rotated = minimalRotation(cyc, F.shape);
    const seq = Array.from(rotated, (x) => F.shape[x]!);
    const key = `${cyc.length}:${seq.join(",")}`;
    const cls = classes.get(key);
    if (cls) cls.cycles.push(rotated);
    else classes.set(key, { seq, cycles: [rotated] });
  }
  const gCycles = G.cycles;
  const slots: { cls: CycleClass; index: number }[] = [];
  for (const cls of classes.values())
    for (let k = 0; k < Math.min(cls.cycles.length, gCycles.length); k++) slots.push({ cls, index: k });
  const rotationFor = (gi: number, cls: CycleClass): number => {
    const gc = gCycles[gi]!;
    if (gc.length !== cls.seq.length) return -1;
    const L = gc.length;
    for (let r = 0; r < L; r++) {
      let ok = true;
      for (let i = 0; i < L && ok; i++) ok = embeds(G.shape[gc[i]!]!, cls.seq[(i + r) % L]!);
      if (ok) return r;
    }
    return -1;
  };
  control.onProgress?.(0.5, "matching attractors");
  const cycleMatch = bipartiteMatch(gCycles.length, slots.length, (i, j) => rotationFor(i, slots[j]!.cls) >= 0);
  if (!cycleMatch) return null;

  const map = new Uint32Array(targetSucc.length);
  const embedTree = (g: number, f: number) => {
    map[g] = f;
    const gKids = G.children.subarray(G.childStart[g]!, G.childStart[g + 1]!);
    if (gKids.length === 0) return;
    const fKids = F.children.subarray(F.childStart[f]!, F.childStart[f + 1]!);
    const chosen = matchShapes(
      Array.from(gKids, (x) => G.shape[x]!),
      Array.from(fKids, (x) => F.shape[x]!),
    );
    if (!chosen) throw new EngineError("INTERNAL", "an in-tree that embeds by shape failed to embed");
    const pools = new Map<number, number[]>();
    for (const x of fKids) {
      const s = F.shape[x]!;
      const pool = pools.get(s);
      if (pool) pool.push(x);
      else pools.set(s, [x]);
    }
    gKids.forEach((x, i) => embedTree(x, pools.get(chosen[i]!)!.pop()!));
  };
  cycleMatch.forEach((j, gi) => {
    const slot = slots[j]!;
    const r = rotationFor(gi, slot.cls);
    const fc = slot.cls.cycles[slot.index]!;
    const gc = gCycles[gi]!;
    for (let i = 0; i < gc.length; i++) embedTree(gc[i]!, fc[(i + r) % gc.length]!);
  });
  control.onProgress?.(1, "matching attractors");
  return map;
}

/** The rotation of a cycle whose shape sequence is lexicographically smallest (plain quadratic scan). */
function minimalRotation(cyc: Uint32Array, shape: Int32Array): Uint32Array {
  const L = cyc.length;
  let best = 0;
  for (let r = 1; r < L; r++) {
    for (let i = 0; i < L; i++) {
      const a = shape[cyc[(r + i) % L]!]!;
      const b = shape[cyc[(best + i) % L]!]!;
      if (a !== b) {
        if (a < b) best = r;
        break;
      }
    }
  }
  const out = new Uint32Array(L);
  for (let i = 0; i < L; i++) out[i] = cyc[(best + i) % L]!;
  return out;
}

/** Kuhn's augmenting paths: a match of every left vertex to a distinct right vertex, or null. */
function bipartiteMatch(left: number, right: number, edge: (i: number, j: number) => boolean): number[] | null {
  if (left > right) return null;
  const owner = new Int32Array(right).fill(-1);
  const assigned = new Array<number>(left).fill(-1);
  const cache = new Map<number, boolean>();
  const has = (i: number, j: number) => {
    const key = i * right + j;
    let v = cache.get(key);
    if (v === undefined) {
      v = edge(i, j);
      cache.set(key, v);
    }
    return v;
  };
  for (let i = 0; i < left; i++) {
    const visited = new Uint8Array(right);
    const tryAugment = (u: number): boolean => {
      for (let j = 0; j < right; j++) {
        if (visited[j] || !has(u, j)) continue;
        visited[j] = 1;
        if (owner[j] === -1 || tryAugment(owner[j]!)) {
          owner[j] = u;
          assigned[u] = j;
          return true;
        }
      }
      return false;
    };
    if (!tryAugment(i)) return null;
  }
  return assigned;
}

/** Decide whether F at time scale `time` dynamically embeds G (F up to 22 nodes, G up to 12). */
export function findDynamicalEmbedding(
  source: BooleanNetwork,
  target: BooleanNetwork,
  time: number,
  control: EmbeddingControl = {},
): EmbeddingResult {
  if (target.names.length > 12) throw new EngineError("TOO_LARGE", "embedding targets have at most 12 nodes");
  control.onProgress?.(0, "tabulating the source map");
  const map = embedFunctionalGraph(transitionTable(source, time), successorsOfNetwork(target), control);
  return { found: map !== null, time, map };
}

/** Smallest time scale in 1..maxTime at which F embeds G, or found=false at maxTime. */
export function searchDynamicalEmbedding(
  source: BooleanNetwork,
  target: BooleanNetwork,
  maxTime: number,
  control: EmbeddingControl = {},
): EmbeddingResult {
  let last: EmbeddingResult = { found: false, time: maxTime, map: null };
  for (let t = 1; t <= maxTime; t++) {
    last = findDynamicalEmbedding(source, target, t, {
      shouldStop: control.shouldStop,
      onProgress: (f, phase) => control.onProgress?.((t - 1 + f) / maxTime, phase),
    });
    if (last.found) return last;
  }
  return last;
}
