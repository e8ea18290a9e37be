// Given-target block emulation as satisfiability: block membership, codeword and context bits are variables and
// F^t is unrolled over the 2^m encoded states (Tseitin-style clauses per truth-table row; Biere, Cimatti, Clarke,
// Zhu, "Symbolic model checking without BDDs", TACAS 1999, for the unrolling idea), solved by MiniSat.
import type { BooleanNetwork } from "../network";
import type { BlockEmulationWitness, EmulationBlock } from "./block-witness";
import { MiniSatHandle } from "./minisat-handle";

export interface EmulationSatProblem {
  readonly source: BooleanNetwork;
  /** G's successor table over its 2^m states, or null to leave G free (discover mode: G's table bits are variables). */
  readonly targetSucc: ArrayLike<number> | null;
  readonly targetNodes: number;
  readonly time: number;
  readonly maxBlock: number;
  /** allowed[v] = 1 when source node v may belong to a block (others are context). */
  readonly allowed: Uint8Array;
  readonly contextAllowed: boolean;
}

/**
 * One time scale's formula, built once and queried incrementally for ranges of units: a unit fixes the smallest
 * source node of block 0, the split the search shards on.
 */
export class EmulationSatInstance {
  private readonly sat = new MiniSatHandle();
  private readonly inVar: Int32Array; // v * m + j, 0 when v may not join blocks
  private readonly wVar: Int32Array; // v * states + x
  private readonly gVar: Int32Array; // x * m + j: bit j of G(x) in discover mode
  private readonly impossible: boolean;

  constructor(private readonly p: EmulationSatProblem) {
    const { source, targetSucc, time } = p;
    const n = source.names.length;
    const m = p.targetNodes;
    const states = 2 ** m;
    const sat = this.sat;
    const clause = (...lits: number[]) => sat.clause(lits);
    this.inVar = new Int32Array(n * m);
    this.wVar = new Int32Array(n * states);
    const ctxVar = new Int32Array(n);
    this.gVar = targetSucc ? new Int32Array(0) : Int32Array.from({ length: states * m }, () => sat.newVar());
    let impossible = false;
    for (let v = 0; v < n; v++) {
      if (!p.allowed[v]) {
        if (!p.contextAllowed) impossible = true;
        // A node that may not join a block is context: one value variable shared by all encoded states.
        const w = sat.newVar();
        for (let x = 0; x < states; x++) this.wVar[v * states + x] = w;
        continue;
      }
      for (let x = 0; x < states; x++) this.wVar[v * states + x] = sat.newVar();
      for (let j = 0; j < m; j++) this.inVar[v * m + j] = sat.newVar();
      const ctx = sat.newVar();
      ctxVar[v] = ctx;
      const ins = Array.from(this.inVar.subarray(v * m, v * m + m));
      const w = (x: number) => this.wVar[v * states + x]!;
      clause(ctx, ...ins);
      for (let j = 0; j < m; j++) {
        clause(-ins[j]!, -ctx);
        for (let k = j + 1; k < m; k++) clause(-ins[j]!, -ins[k]!);
      }
      if (!p.contextAllowed) clause(-ctx);
      for (let x = 1; x < states; x++) {
        clause(-ctx, -w(x), w(0));
        clause(-ctx, w(x), -w(0));
      }
      // A block node's value depends on its own target bit only.
      for (let j = 0; j < m; j++) {
        for (let k = 0; k < m; k++) {
          if (k === j) continue;
          for (let x = 0; x < states; x++) {
            if ((x >>> k) & 1) continue;
            const y = x | (1 << k);
            clause(-ins[j]!, -w(x), w(y));
            clause(-ins[j]!, w(x), -w(y));
          }
        }
      }
    }
    for (let j = 0; j < m; j++) {
      const members: number[] = [];
      const differs: number[] = [];
      for (let v = 0; v < n; v++) {
        if (!p.allowed[v]) continue;
        const b = this.inVar[v * m + j]!;
        members.push(b);
        const d = sat.newVar();
        differs.push(d);
        const w0 = this.wVar[v * states]!;
        const w1 = this.wVar[v * states + (1 << j)]!;
        clause(-d, b);
        clause(-d, w0, w1);
        clause(-d, -w0, -w1);
      }
      if (differs.length === 0) impossible = true;
      else clause(...differs);
      atMost(sat, members, p.maxBlock);
    }
    const layer = new Int32Array(n * states);
    let prev = this.wVar;
    for (let step = 1; step <= time; step++) {
      const cur = step === time ? null : Int32Array.from(layer, () => sat.newVar());
      for (let x = 0; x < states; x++) {
        for (let v = 0; v < n; v++) {
          const regs = source.regulators[v]!;
          const table = source.tables[v]!;
          const out = cur
            ? cur[v * states + x]!
            : targetSucc
              ? this.wVar[v * states + targetSucc[x]!]!
              : this.freeImage(v, x, ctxVar[v]!);
          const inputs = Array.from(regs, (r) => prev[r * states + x]!);
          for (let row = 0; row < table.length; row++) {
            const lits: number[] = [];
            for (let q = 0; q < inputs.length; q++) lits.push((row >> q) & 1 ? -inputs[q]! : inputs[q]!);
            lits.push(table[row] ? out : -out);
            sat.clause(lits);
          }
        }
      }
      if (cur) prev = cur;
    }
    this.impossible = impossible;
  }

  /**
   * Discover mode: the variable for node v of e(G(x)), tied to G's table bits: a context node keeps its value, a
   * node of block j takes its codeword bit for G(x)_j.
   */
  private freeImage(v: number, x: number, ctx: number): number {
    const m = this.p.targetNodes;
    const states = 2 ** m;
    const a0 = this.wVar[v * states]!;
    if (!this.p.allowed[v]) return a0;
    const o = this.sat.newVar();
    const clause = (...lits: number[]) => this.sat.clause(lits);
    clause(-ctx, -o, a0);
    clause(-ctx, o, -a0);
    for (let j = 0; j < m; j++) {
      const b = this.inVar[v * m + j]!;
      const g = this.gVar[x * m + j]!;
      const a1 = this.wVar[v * states + (1 << j)]!;
      clause(-b, -g, -o, a1);
      clause(-b, -g, o, -a1);
      clause(-b, g, -o, a0);
      clause(-b, g, o, -a0);
    }
    return o;
  }

  /**
   * Discover mode: the next target (with its witness) not equal up to relabelling to any returned before, or null.
   * `relabellings` lists, for a found table, every table equivalent to it; all of them are excluded afterwards.
   */
  nextTarget(
    relabellings: (succ: readonly number[]) => number[][],
  ): { succ: number[]; witness: BlockEmulationWitness } | null {
    if (this.impossible || this.p.targetSucc) return null;
    const values = this.sat.solve();
    if (!values) return null;
    const m = this.p.targetNodes;
    const succ = Array.from({ length: 2 ** m }, (_, x) => {
      let y = 0;
      for (let j = 0; j < m; j++) if (values[this.gVar[x * m + j]!] === true) y |= 1 << j;
      return y;
    });
    for (const h of relabellings(succ)) {
      const lits: number[] = [];
      h.forEach((y, x) => {
        for (let j = 0; j < m; j++) lits.push((y >>> j) & 1 ? -this.gVar[x * m + j]! : this.gVar[x * m + j]!);
      });
      this.sat.clause(lits);
    }
    return { succ, witness: this.witnessFrom(values) };
  }

  /** A witness whose block 0 has its smallest node in [lo, hi), or null when there is none. */
  solveRange(lo: number, hi: number): BlockEmulationWitness | null {
    if (this.impossible) return null;
    const n = this.p.source.names.length;
    const m = this.p.targetNodes;
    const starts: number[] = [];
    for (let v = Math.max(0, lo); v < Math.min(n, hi); v++) if (this.p.allowed[v]) starts.push(this.inVar[v * m]!);
    if (starts.length === 0) return null;
    const assume = this.sat.newVar();
    for (let v = 0; v < Math.min(lo, n); v++) if (this.p.allowed[v]) this.sat.clause([-assume, -this.inVar[v * m]!]);
    this.sat.clause([-assume, ...starts]);
    const values = this.sat.solve(assume);
    return values ? this.witnessFrom(values) : null;
  }

  private witnessFrom(values: (boolean | null)[]): BlockEmulationWitness {
    const n = this.p.source.names.length;
    const m = this.p.targetNodes;
    const states = 2 ** m;
    const on = (v: number) => values[v] === true;
    const blocks: { nodes: number[]; zero: number[]; one: number[] }[] = [];
    for (let j = 0; j < m; j++) blocks.push({ nodes: [], zero: [], one: [] });
    const context: number[] = [];
    for (let v = 0; v < n; v++) {
      let owner = -1;
      if (this.p.allowed[v]) for (let j = 0; j < m; j++) if (on(this.inVar[v * m + j]!)) owner = j;
      const w0 = on(this.wVar[v * states]!) ? 1 : 0;
      if (owner === -1) {
        context.push(w0);
        continue;
      }
      context.push(-1);
      const b = blocks[owner]!;
      b.nodes.push(v);
      b.zero.push(w0);
      b.one.push(on(this.wVar[v * states + (1 << owner)]!) ? 1 : 0);
    }
    return { time: this.p.time, blocks: blocks as EmulationBlock[], context };
  }
}

/** Sinz's sequential counter for "at most k of these are true" (Sinz, "Towards an optimal CNF encoding of Boolean cardinality constraints", CP 2005). */
function atMost(sat: MiniSatHandle, lits: readonly number[], k: number): void {
  const n = lits.length;
  if (k >= n) return;
  if (k === 0) {
    for (const l of lits) sat.clause([-l]);
    return;
  }
  let prev: number[] = [];
  for (let i = 0; i < n; i++) {
    const x = lits[i]!;
    const s = Array.from({ length: k }, () => sat.newVar()); // s[c] = "at least c+1 of the first i+1 are true"
    sat.clause([-x, s[0]!]);
    if (i === 0) {
      for (let c = 1; c < k; c++) sat.clause([-s[c]!]);
    } else {
      for (let c = 0; c < k; c++) sat.clause([-prev[c]!, s[c]!]);
      for (let c = 1; c < k; c++) sat.clause([-x, -prev[c - 1]!, s[c]!]);
      sat.clause([-x, -prev[k - 1]!]);
    }
    prev = s;
  }
}
