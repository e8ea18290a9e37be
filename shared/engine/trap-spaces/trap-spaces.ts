// Minimal and maximal trap spaces: subspaces that asynchronous update never leaves, found with a SAT solver
// (Klarner, Bockmayr, Siebert, "Computing maximal and minimal trap spaces of Boolean networks", Natural Computing
// 2015, who use prime implicants and answer-set programming). A subspace S fixes node i to 1 legitimately when f_i
// is 1 on all of S, that is when S meets no cube of a cover of f_i = 0: some input of each such cube is fixed to
// the opposite value. Two variables per node (fixed to 1, fixed to 0) and one clause per cube give the exact
// condition without auxiliaries. Inclusion-minimal (or maximal) solutions are reached by asking for a strictly
// smaller (larger) trap space until there is none, then blocking every trap space that contains (lies in) the one
// found; each blocked solution contains (lies in) a recorded one, so the enumeration is complete when the solver
// finds no more. Minimal trap spaces all fix the nodes that percolation fixes, so the search runs on the rest; and
// every fixed point is a minimal trap space, found far faster by the plain fixed-point encoding, so fixed points are
// enumerated first and blocked, and the trap-space solver only has to look for the cyclic ones (measured on chaotic
// 400-node networks of in-degree 3: two thirds of the time went into reaching fixed points through the trap-space
// encoding).
import { CancelledError, EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import type { Progress, ShouldStop } from "../progress";
import { ClauseSolver, tableCubes } from "../sat";
import { FREE, fixedByName, percolate, restrictToSubspace, subspacePattern } from "./subspace";

/** Largest network the trap-space search accepts (the bench shows 1,000 nodes of in-degree 2 in seconds). */
export const MAX_TRAP_SPACE_NODES = 5_000;
/** Default cap on the number of trap spaces listed (blocking clauses of many more can fill the solver's heap). */
export const DEFAULT_TRAP_SPACE_LIMIT = 1_000;

export type TrapSpaceKind = "minimal" | "maximal";

export interface TrapSpace {
  /** The fixed nodes by name (a fixed point fixes every node). */
  readonly fixed: Record<string, 0 | 1>;
  /** One character per node in node order: '0', '1', or '-' for a free node. */
  readonly pattern: string;
}

export interface TrapSpaceSearch {
  readonly nodes: string[];
  readonly kind: TrapSpaceKind;
  /** False when `limit` cut the list: more trap spaces of this kind exist. */
  readonly complete: boolean;
  /** Sorted by pattern. */
  readonly trapSpaces: TrapSpace[];
  /** Nodes fixed by percolation before the search (minimal trap spaces only; 0 for maximal). */
  readonly percolatedNodes: number;
}

export interface TrapSpaceOptions {
  readonly kind?: TrapSpaceKind;
  /** Stop after this many trap spaces (default DEFAULT_TRAP_SPACE_LIMIT). */
  readonly limit?: number;
  readonly onProgress?: Progress;
  readonly shouldStop?: ShouldStop;
}

/** Every minimal (default) or maximal trap space, up to `limit`. */
export function trapSpaces(net: BooleanNetwork, options: TrapSpaceOptions = {}): TrapSpaceSearch {
  const kind = options.kind ?? "minimal";
  const found: Int8Array[] = [];
  const run = forEachTrapSpace(net, { ...options, kind }, (s) => void found.push(s));
  const trapSpaces = found
    .map((s) => ({ fixed: fixedByName(net, s), pattern: subspacePattern(s) }))
    .sort((a, b) => (a.pattern < b.pattern ? -1 : a.pattern > b.pattern ? 1 : 0));
  return { nodes: [...net.names], kind, complete: run.complete, trapSpaces, percolatedNodes: run.percolatedNodes };
}

/**
 * The callback form: `visit` receives each trap space as a subspace vector (-1 free, 0, 1) as soon as it is proved
 * minimal or maximal. Returns whether the enumeration finished (false when `limit` stopped it with more to find).
 */
export function forEachTrapSpace(
  net: BooleanNetwork,
  options: TrapSpaceOptions,
  visit: (subspace: Int8Array) => void,
): { complete: boolean; percolatedNodes: number } {
  const n = net.names.length;
  const kind = options.kind ?? "minimal";
  const limit = options.limit ?? DEFAULT_TRAP_SPACE_LIMIT;
  if (n > MAX_TRAP_SPACE_NODES)
    throw new EngineError(
      "TOO_LARGE",
      `the trap-space search supports at most ${MAX_TRAP_SPACE_NODES} nodes; this network has ${n}`,
    );
  if (!(Number.isInteger(limit) && limit >= 1))
    throw new EngineError("BAD_ARGUMENT", `limit must be a positive integer, got ${limit}`);
  const { onProgress, shouldStop } = options;
  const base = kind === "minimal" ? percolate(net) : new Int8Array(n).fill(FREE);
  let percolatedNodes = 0;
  for (let i = 0; i < n; i++) if (base[i] !== FREE) percolatedNodes++;
  const { network: rest, nodes } = restrictToSubspace(net, base);
  const m = nodes.length;
  const lift = (local: Int8Array): Int8Array => {
    const full = Int8Array.from(base);
    for (let i = 0; i < m; i++) full[nodes[i]!] = local[i]!;
    return full;
  };

  // Variables 2i and 2i+1 stand for "node i fixed to 1" and "fixed to 0". MiniSat decides unset variables false
  // first, so for minimal trap spaces each variable is stored negated: the solver then leans towards fixing nodes
  // and its first answer is already close to minimal, which shortens the chain of shrinking steps.
  const solver = new ClauseSolver();
  const sign = kind === "minimal" ? -1 : 1;
  const vars = Int32Array.from({ length: 2 * m }, () => solver.newVar());
  const fixLit = (i: number, value: number) => sign * vars[2 * i + (value === 1 ? 0 : 1)]!;
  for (let i = 0; i < m; i++) {
    solver.clause([-fixLit(i, 1), -fixLit(i, 0)]);
    const regs = rest.regulators[i]!;
    const table = rest.tables[i]!;
    for (const value of [1, 0] as const) {
      // Fixing i to `value` needs every cube where f_i takes the other value excluded.
      for (const cube of tableCubes(table, regs.length, value === 1 ? 0 : 1)) {
        const clause = [-fixLit(i, value)];
        for (let j = 0; j < regs.length; j++)
          if (cube.mask & (1 << j)) clause.push(fixLit(regs[j]!, (cube.value >> j) & 1 ? 0 : 1));
        solver.clause(clause);
      }
    }
  }
  const decode = (solution: (boolean | null)[]): Int8Array => {
    const s = new Int8Array(m).fill(FREE);
    const holds = (lit: number) => (lit > 0 ? solution[lit] === true : solution[-lit] !== true);
    for (let i = 0; i < m; i++) s[i] = holds(fixLit(i, 1)) ? 1 : holds(fixLit(i, 0)) ? 0 : FREE;
    return s;
  };
  // Literals that are false in s: the ways a subspace can fix more than s does (or differently).
  const fixingsOutside = (s: Int8Array): number[] => {
    const out: number[] = [];
    for (let i = 0; i < m; i++) {
      if (s[i] !== 1) out.push(fixLit(i, 1));
      if (s[i] !== 0) out.push(fixLit(i, 0));
    }
    return out;
  };
  const fixingsInside = (s: Int8Array): number[] => {
    const out: number[] = [];
    for (let i = 0; i < m; i++) if (s[i] !== FREE) out.push(fixLit(i, s[i]!));
    return out;
  };
  let count = 0;
  if (kind === "maximal") solver.clause(fixingsOutside(new Int8Array(m).fill(FREE)));
  else {
    // Fixed points are the trap spaces that fix every node; asked for first, under a guard, they come quickly.
    onProgress?.(0, "fixed points");
    const everyNodeFixed = solver.newVar();
    for (let i = 0; i < m; i++) solver.clause([-everyNodeFixed, fixLit(i, 1), fixLit(i, 0)]);
    for (;;) {
      if (shouldStop?.()) throw new CancelledError();
      const ask = solver.newVar();
      solver.clause([-ask, everyNodeFixed]);
      const point = solver.solve(ask);
      if (!point) break;
      if (count >= limit) return { complete: false, percolatedNodes };
      const s = decode(point);
      visit(lift(s));
      count++;
      solver.clause(fixingsOutside(s));
    }
    solver.retire(everyNodeFixed);
  }
  for (;;) {
    if (shouldStop?.()) throw new CancelledError();
    const solution = solver.solve();
    if (!solution) break;
    if (count >= limit) return { complete: false, percolatedNodes };
    let current = decode(solution);
    // Shrink (minimal) or grow (maximal) under an activation variable that pins what is already decided.
    const pin = solver.newVar();
    const pinned = (s: Int8Array) =>
      kind === "minimal"
        ? fixingsInside(s).forEach((lit) => solver.clause([-pin, lit]))
        : fixingsOutside(s).forEach((lit) => solver.clause([-pin, -lit]));
    pinned(current);
    for (;;) {
      if (shouldStop?.()) throw new CancelledError();
      const step = solver.newVar();
      solver.clause([-step, pin]);
      solver.clause([-step, ...(kind === "minimal" ? fixingsOutside(current) : fixingsInside(current).map((l) => -l))]);
      const better = solver.solve(step);
      if (!better) break;
      current = decode(better);
      pinned(current);
    }
    solver.retire(pin);
    visit(lift(current));
    count++;
    onProgress?.(Math.min(count / limit, 1), `${kind} trap spaces: ${count} found`);
    // Block every trap space that contains (minimal) or lies inside (maximal) the one just found.
    solver.clause(kind === "minimal" ? fixingsOutside(current) : fixingsInside(current).map((l) => -l));
  }
  onProgress?.(1, `${kind} trap spaces: ${count} found`);
  return { complete: true, percolatedNodes };
}
