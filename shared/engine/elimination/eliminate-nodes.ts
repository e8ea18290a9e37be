// Node elimination: a node v whose function does not read v itself is removed by substituting f_v for x_v in the
// functions of the nodes it regulates. Fixed points of the reduced network correspond one to one to those of the
// original (x_v = f_v at a fixed point), as shown by Naldi, Remy, Thieffry and Chaouiya, "Dynamically consistent
// reduction of logical regulatory graphs", Theoretical Computer Science 2011, and by Veliz-Cuba, "Reduction of
// Boolean network models", Journal of Theoretical Biology 2011. Other attractors are not preserved in general.
// Substitution merges regulator lists, so each target's truth table can double per new regulator: an elimination
// that would give a node more than the engine's regulator limit is refused (or, for "all eligible", skipped).
import { CancelledError, EngineError } from "../errors";
import { checkNetwork, type BooleanNetwork } from "../network";
import type { Progress, ShouldStop } from "../progress";
import { essentialPart } from "../trap-spaces";

/** The engine's per-node regulator limit (see network/build.ts), which no substitution may exceed. */
export const MAX_ELIMINATION_REGULATORS = 20;
/** Largest network accepted by node elimination. */
export const MAX_ELIMINATION_NODES = 10_000;

export const ELIMINATION_PRESERVES =
  "Fixed points, one to one: each fixed point of the reduced model extends to exactly one fixed point of the " +
  "original, the eliminated nodes taking the values of their functions (Naldi, Remy, Thieffry, Chaouiya, TCS 2011; " +
  "Veliz-Cuba, J. Theor. Biol. 2011). Cycles and cyclic attractors are not guaranteed to be preserved.";

export interface EliminationOptions {
  /** Refuse (explicit nodes) or skip (all eligible) eliminations that give a node more regulators than this. */
  readonly maxRegulators?: number;
  readonly onProgress?: Progress;
  readonly shouldStop?: ShouldStop;
}

export interface EliminationResult {
  /** The reduced network (remaining nodes in their original order). */
  readonly network: BooleanNetwork;
  /** Eliminated nodes in the order they were removed. */
  readonly eliminated: string[];
  /** With "all eligible": nodes without self-regulation left in because eliminating them broke the regulator limit. */
  readonly skipped: { readonly node: string; readonly regulators: number }[];
  readonly preserves: string;
}

interface Working {
  regs: number[][];
  tables: Uint8Array[];
  readers: Set<number>[];
  alive: Uint8Array;
}

/**
 * Eliminate the named nodes in the order given, or with "all-eligible" every node that can be eliminated, cheapest
 * first (the one whose targets gain the fewest truth-table rows), until none is left.
 */
export function eliminateNodes(
  net: BooleanNetwork,
  nodes: readonly string[] | "all-eligible",
  options: EliminationOptions = {},
): EliminationResult {
  const n = net.names.length;
  if (n > MAX_ELIMINATION_NODES)
    throw new EngineError(
      "TOO_LARGE",
      `node elimination supports at most ${MAX_ELIMINATION_NODES} nodes; this network has ${n}`,
    );
  const limit = Math.min(options.maxRegulators ?? MAX_ELIMINATION_REGULATORS, MAX_ELIMINATION_REGULATORS);
  const { onProgress, shouldStop } = options;
  const w = working(net);
  const eliminated: number[] = [];
  if (nodes !== "all-eligible") {
    const index = new Map(net.names.map((name, i) => [name, i] as const));
    const order = nodes.map((name) => {
      const i = index.get(name);
      if (i === undefined) throw new EngineError("UNKNOWN_NODE", `there is no node named "${name}"`);
      return i;
    });
    if (new Set(order).size !== order.length) throw new EngineError("BAD_ARGUMENT", "a node is named twice");
    order.forEach((v, step) => {
      if (shouldStop?.()) throw new CancelledError();
      onProgress?.(step / order.length, "eliminating nodes");
      if (w.regs[v]!.includes(v))
        throw new EngineError(
          "SELF_REGULATED",
          `node "${net.names[v]}" regulates itself${eliminated.length ? " after the earlier eliminations" : ""}, so it cannot be eliminated`,
        );
      const worst = largestTarget(w, v);
      if (worst.size > limit)
        throw new EngineError(
          "TOO_MANY_REGULATORS",
          `eliminating "${net.names[v]}" would give node "${net.names[worst.node]}" ${worst.size} regulators; at most ${limit} are supported`,
        );
      substitute(w, v);
      eliminated.push(v);
    });
    onProgress?.(1, "eliminating nodes");
    return result(net, w, eliminated, []);
  }
  // Rounds: rank the eligible nodes by cost, eliminate in that order while each still fits, repeat until a round
  // removes nothing (costs change as regulator lists merge, so they are checked again before each step).
  const skipped = new Map<number, number>();
  for (let changed = true; changed;) {
    changed = false;
    const candidates: { v: number; cost: number }[] = [];
    for (let v = 0; v < n; v++) if (w.alive[v] && !w.regs[v]!.includes(v)) candidates.push({ v, cost: cost(w, v) });
    candidates.sort((a, b) => a.cost - b.cost || a.v - b.v);
    for (const { v } of candidates) {
      if (shouldStop?.()) throw new CancelledError();
      if (!w.alive[v] || w.regs[v]!.includes(v)) continue;
      const worst = largestTarget(w, v);
      if (worst.size > limit) {
        skipped.set(v, worst.size);
        continue;
      }
      skipped.delete(v);
      substitute(w, v);
      eliminated.push(v);
      changed = true;
      onProgress?.(eliminated.length / n, "eliminating nodes");
    }
  }
  const left = [...skipped].filter(([v]) => w.alive[v] && !w.regs[v]!.includes(v));
  onProgress?.(1, "eliminating nodes");
  return result(
    net,
    w,
    eliminated,
    left.map(([v, size]) => ({ node: net.names[v]!, regulators: size })),
  );
}

/** Nodes that can be eliminated now: those whose function does not depend on their own value. */
export function eligibleNodes(net: BooleanNetwork): string[] {
  const w = working(net);
  return net.names.filter((_, v) => !w.regs[v]!.includes(v));
}

function working(net: BooleanNetwork): Working {
  const n = net.names.length;
  const regs: number[][] = [];
  const tables: Uint8Array[] = [];
  const readers = Array.from({ length: n }, () => new Set<number>());
  for (let i = 0; i < n; i++) {
    const part = essentialPart(Array.from(net.regulators[i]!), net.tables[i]!);
    regs.push(part.regulators);
    tables.push(part.table);
    for (const r of part.regulators) readers[r]!.add(i);
  }
  return { regs, tables, readers, alive: new Uint8Array(n).fill(1) };
}

function mergedRegulators(w: Working, v: number, target: number): number[] {
  const merged = w.regs[target]!.filter((r) => r !== v);
  for (const r of w.regs[v]!) if (!merged.includes(r)) merged.push(r);
  return merged;
}

function largestTarget(w: Working, v: number): { node: number; size: number } {
  let worst = { node: v, size: 0 };
  for (const t of w.readers[v]!) {
    if (t === v) continue;
    const size = mergedRegulators(w, v, t).length;
    if (size > worst.size) worst = { node: t, size };
  }
  return worst;
}

/** Truth-table rows the targets would hold after eliminating v (a proxy for the work and the growth it causes). */
function cost(w: Working, v: number): number {
  let rows = 0;
  for (const t of w.readers[v]!) if (t !== v) rows += 2 ** mergedRegulators(w, v, t).length;
  return rows;
}

function substitute(w: Working, v: number): void {
  const vRegs = w.regs[v]!;
  const vTable = w.tables[v]!;
  for (const t of [...w.readers[v]!]) {
    if (t === v) continue;
    const tRegs = w.regs[t]!;
    const tTable = w.tables[t]!;
    const merged = mergedRegulators(w, v, t);
    const posInMerged = new Map(merged.map((r, j) => [r, j] as const));
    const vPos = tRegs.indexOf(v);
    const table = new Uint8Array(1 << merged.length);
    for (let row = 0; row < table.length; row++) {
      let vRow = 0;
      for (let j = 0; j < vRegs.length; j++) vRow |= ((row >> posInMerged.get(vRegs[j]!)!) & 1) << j;
      const vValue = vTable[vRow]!;
      let tRow = 0;
      for (let j = 0; j < tRegs.length; j++) {
        const bit = j === vPos ? vValue : (row >> posInMerged.get(tRegs[j]!)!) & 1;
        tRow |= bit << j;
      }
      table[row] = tTable[tRow]!;
    }
    const part = essentialPart(merged, table);
    for (const r of tRegs) w.readers[r]!.delete(t);
    w.regs[t] = part.regulators;
    w.tables[t] = part.table;
    for (const r of part.regulators) w.readers[r]!.add(t);
  }
  for (const r of vRegs) w.readers[r]!.delete(v);
  w.readers[v]!.clear();
  w.alive[v] = 0;
}

function result(
  net: BooleanNetwork,
  w: Working,
  eliminated: number[],
  skipped: EliminationResult["skipped"],
): EliminationResult {
  const n = net.names.length;
  const position = new Int32Array(n).fill(-1);
  const kept: number[] = [];
  for (let i = 0; i < n; i++) if (w.alive[i]) ((position[i] = kept.length), kept.push(i));
  const network = checkNetwork({
    names: kept.map((i) => net.names[i]!),
    regulators: kept.map((i) => Int32Array.from(w.regs[i]!, (r) => position[r]!)),
    tables: kept.map((i) => w.tables[i]!),
  });
  return {
    network,
    eliminated: eliminated.map((v) => net.names[v]!),
    skipped,
    preserves: ELIMINATION_PRESERVES,
  };
}
