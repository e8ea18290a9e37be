// Given-target block emulation as satisfiability: block membership, codeword and context bits are variables and
// F^t is unrolled over the 2^m encoded states (Tseitin-style clauses per truth-table row; Biere, Cimatti, Clarke,
// Zhu, "Symbolic model checking without BDDs", TACAS 1999, for the unrolling idea). Solved with logic-solver (MiniSat).
import Logic from "logic-solver";
import type { BooleanNetwork } from "../network";
import type { BlockEmulationWitness, EmulationBlock } from "./block-witness";

export interface EmulationSatProblem {
  readonly source: BooleanNetwork;
  /** G's successor table over its 2^m states. */
  readonly targetSucc: ArrayLike<number>;
  readonly targetNodes: number;
  readonly time: number;
  readonly maxBlock: number;
  /** allowed[v] = 1 when source node v may belong to a block (others are context). */
  readonly allowed: Uint8Array;
  readonly contextAllowed: boolean;
  /** Restrict the smallest source node of block 0 to [lo, hi): the unit of work the search splits on. */
  readonly firstBlockMin: readonly [number, number];
}

/** One satisfiability query; returns a witness or null when none satisfies the problem's restrictions. */
export function solveEmulationSat(p: EmulationSatProblem): BlockEmulationWitness | null {
  const { source, targetSucc, time } = p;
  const n = source.names.length;
  const m = p.targetNodes;
  const states = 2 ** m;
  const [lo, hi] = p.firstBlockMin;
  const solver = new Logic.Solver();
  const clause = (...lits: string[]) => solver.require(Logic.or(...lits));
  const neg = (l: string) => (l.startsWith("-") ? l.slice(1) : "-" + l);
  const inVar = (v: number, j: number) => `b${v}_${j}`;
  const ctxVar = (v: number) => `c${v}`;
  // A node that may not join a block is context: its value is one variable shared by all encoded states.
  const wVar = (v: number, x: number) => (p.allowed[v] ? `w${v}_${x}` : `w${v}_0`);

  for (let v = 0; v < n; v++) {
    if (!p.allowed[v]) {
      if (!p.contextAllowed) return null;
      continue;
    }
    const ins: string[] = [];
    for (let j = 0; j < m; j++) ins.push(inVar(v, j));
    clause(ctxVar(v), ...ins);
    for (let j = 0; j < m; j++) {
      clause(neg(ins[j]!), neg(ctxVar(v)));
      for (let k = j + 1; k < m; k++) clause(neg(ins[j]!), neg(ins[k]!));
    }
    if (!p.contextAllowed) clause(neg(ctxVar(v)));
    for (let x = 1; x < states; x++) {
      clause(neg(ctxVar(v)), neg(wVar(v, x)), wVar(v, 0));
      clause(neg(ctxVar(v)), wVar(v, x), neg(wVar(v, 0)));
    }
    // A block node's value depends on its own target bit only.
    for (let j = 0; j < m; j++) {
      for (let k = 0; k < m; k++) {
        if (k === j) continue;
        for (let x = 0; x < states; x++) {
          if ((x >>> k) & 1) continue;
          const y = x | (1 << k);
          clause(neg(inVar(v, j)), neg(wVar(v, x)), wVar(v, y));
          clause(neg(inVar(v, j)), wVar(v, x), neg(wVar(v, y)));
        }
      }
    }
    // The shard restriction on where block 0 starts.
    if (v < lo) clause(neg(inVar(v, 0)));
  }
  const firstCandidates: string[] = [];
  for (let v = Math.max(0, lo); v < Math.min(n, hi); v++) if (p.allowed[v]) firstCandidates.push(inVar(v, 0));
  if (firstCandidates.length === 0) return null;
  clause(...firstCandidates);

  for (let j = 0; j < m; j++) {
    const members: string[] = [];
    const witnesses: string[] = [];
    for (let v = 0; v < n; v++) {
      if (!p.allowed[v]) continue;
      members.push(inVar(v, j));
      const d = `d${v}_${j}`;
      witnesses.push(d);
      clause(neg(d), inVar(v, j));
      clause(neg(d), wVar(v, 0), wVar(v, 1 << j));
      clause(neg(d), neg(wVar(v, 0)), neg(wVar(v, 1 << j)));
    }
    if (witnesses.length === 0) return null;
    clause(...witnesses);
    atMost(members, p.maxBlock, `k${j}`, clause, neg);
  }

  const lit = (step: number, v: number, x: number) =>
    step === 0 ? wVar(v, x) : step === time ? wVar(v, targetSucc[x]!) : `s${step}_${v}_${x}`;
  for (let step = 1; step <= time; step++) {
    for (let x = 0; x < states; x++) {
      for (let v = 0; v < n; v++) {
        const regs = source.regulators[v]!;
        const table = source.tables[v]!;
        const out = lit(step, v, x);
        const inputs = Array.from(regs, (r) => lit(step - 1, r, x));
        for (let row = 0; row < table.length; row++) {
          const lits: string[] = [];
          for (let q = 0; q < inputs.length; q++) lits.push((row >> q) & 1 ? neg(inputs[q]!) : inputs[q]!);
          lits.push(table[row] ? out : neg(out));
          clause(...lits);
        }
      }
    }
  }

  const solution = solver.solve();
  if (!solution) return null;
  const truth = new Set(solution.getTrueVars());
  const blocks: { nodes: number[]; zero: number[]; one: number[] }[] = [];
  for (let j = 0; j < m; j++) blocks.push({ nodes: [], zero: [], one: [] });
  const context: number[] = [];
  for (let v = 0; v < n; v++) {
    let owner = -1;
    if (p.allowed[v]) for (let j = 0; j < m; j++) if (truth.has(inVar(v, j))) owner = j;
    if (owner === -1) {
      context.push(truth.has(wVar(v, 0)) ? 1 : 0);
      continue;
    }
    context.push(-1);
    const b = blocks[owner]!;
    b.nodes.push(v);
    b.zero.push(truth.has(wVar(v, 0)) ? 1 : 0);
    b.one.push(truth.has(wVar(v, 1 << owner)) ? 1 : 0);
  }
  return { time, blocks: blocks as EmulationBlock[], context };
}

/** Sinz's sequential counter for "at most k of these are true" (Sinz, "Towards an optimal CNF encoding of Boolean cardinality constraints", CP 2005). */
function atMost(lits: readonly string[], k: number, prefix: string, clause: (...l: string[]) => void, neg: (l: string) => string): void {
  const n = lits.length;
  if (k >= n) return;
  if (k === 0) {
    for (const l of lits) clause(neg(l));
    return;
  }
  const s = (i: number, j: number) => `${prefix}_${i}_${j}`;
  for (let i = 0; i < n; i++) {
    const x = lits[i]!;
    if (i === 0) {
      clause(neg(x), s(0, 1));
      for (let j = 2; j <= k; j++) clause(neg(s(0, j)));
      continue;
    }
    clause(neg(x), s(i, 1));
    clause(neg(s(i - 1, 1)), s(i, 1));
    for (let j = 2; j <= k; j++) {
      clause(neg(x), neg(s(i - 1, j - 1)), s(i, j));
      clause(neg(s(i - 1, j)), s(i, j));
    }
    clause(neg(x), neg(s(i - 1, k)));
  }
}
