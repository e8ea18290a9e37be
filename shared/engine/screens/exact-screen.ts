// Exact synchronous screening with work shared across perturbations. Holding nodes H at values v makes every state
// reach the subspace {x : x_H = v} in one step, and that subspace is closed; so the perturbed dynamics is the
// network with H substituted away (2^(n-|H|) states, analysed by analyseSynchronous) plus one lookup per state
// outside it: its successor is the unperturbed successor with H overwritten, read from the one successor table of
// the unperturbed model. A single perturbation thus costs about half an analysis, a pair about a quarter.
import { checkNetwork, type BooleanNetwork } from "../network";
import { readingOfIndices, resolveAssignment, type Assignment, type NodePattern } from "../expectations";
import { analyseSynchronous, type SynchronousAnalysis } from "../state-graph";
import type { LongTaskOptions } from "../update";
import type { ScreenBaseline, ScreenRow } from "./screen-row";

function hasPattern(reading: string, pattern: NodePattern): boolean {
  for (let q = 0; q < pattern.nodes.length; q++)
    if (reading.charCodeAt(pattern.nodes[q]!) - 48 !== pattern.values[q]) return false;
  return true;
}

export interface ExactScreenContext {
  readonly net: BooleanNetwork;
  readonly phenotype: NodePattern;
  readonly base: SynchronousAnalysis;
  readonly baseKeys: ReadonlySet<string>;
  readonly baseline: ScreenBaseline;
}

/** Analyse the unperturbed model once; every row is computed against it. */
export function exactScreenContext(
  net: BooleanNetwork,
  phenotype: Assignment,
  options: LongTaskOptions = {},
): ExactScreenContext {
  const n = net.names.length;
  const pattern = resolveAssignment(net, phenotype).pattern;
  const base = analyseSynchronous(net, options);
  let phenotypeAttractors = 0;
  let phenotypeBasin = 0;
  for (const a of base.attractors)
    if (hasPattern(readingOfIndices(a.states, n), pattern)) {
      phenotypeAttractors++;
      phenotypeBasin += a.basin;
    }
  return {
    net,
    phenotype: pattern,
    base,
    baseKeys: new Set(base.attractors.map((a) => a.states.join(","))),
    baseline: { attractors: base.attractors.length, phenotypeAttractors, basinShare: phenotypeBasin / base.stateCount },
  };
}

/** The network on the nodes outside `held`, each held node's constant substituted into the tables that read it. */
function substituteHeld(
  net: BooleanNetwork,
  held: ReadonlyMap<number, 0 | 1>,
): { reduced: BooleanNetwork; kept: Int32Array } {
  const n = net.names.length;
  const kept = Int32Array.from({ length: n }, (_, i) => i).filter((i) => !held.has(i));
  const position = new Int32Array(n).fill(-1);
  kept.forEach((node, q) => (position[node] = q));
  const regulators: Int32Array[] = [];
  const tables: Uint8Array[] = [];
  for (const node of kept) {
    const regs = net.regulators[node]!;
    const table = net.tables[node]!;
    const free: number[] = [];
    let fixedRow = 0;
    for (let j = 0; j < regs.length; j++) {
      const v = held.get(regs[j]!);
      if (v === undefined) free.push(j);
      else fixedRow |= v << j;
    }
    const out = new Uint8Array(1 << free.length);
    for (let row = 0; row < out.length; row++) {
      let full = fixedRow;
      for (let q = 0; q < free.length; q++) full |= ((row >> q) & 1) << free[q]!;
      out[row] = table[full]!;
    }
    regulators.push(Int32Array.from(free, (j) => position[regs[j]!]!));
    tables.push(out);
  }
  return { reduced: checkNetwork({ names: Array.from(kept, (i) => net.names[i]!), regulators, tables }), kept };
}

/**
 * Add to basin[a] every state outside the held subspace whose successor (the unperturbed successor with the held
 * bits overwritten) lies in the basin of reduced attractor a. Held bit positions are squeezed out from the highest
 * down, so the lower ones keep their place while the word shrinks. Unrolled for one and two held nodes: this loop
 * over all 2^n states is as costly as the reduced analysis itself.
 */
function countOutsideStates(
  succ: Uint32Array,
  attractorOf: Int32Array,
  heldMask: number,
  heldValues: number,
  heldNodes: number[],
  basin: Float64Array,
): void {
  const removed = [...heldNodes].sort((a, b) => b - a);
  const hi = removed[0] ?? 0;
  const lo = removed[1] ?? -1;
  const hiLow = (1 << hi) - 1;
  const loLow = lo < 0 ? 0 : (1 << lo) - 1;
  if (removed.length === 1) {
    for (let s = 0; s < succ.length; s++) {
      if ((s & heldMask) === heldValues) continue;
      const t = succ[s]!;
      basin[attractorOf[(t & hiLow) | ((t >>> (hi + 1)) << hi)]!]!++;
    }
    return;
  }
  if (removed.length === 2) {
    for (let s = 0; s < succ.length; s++) {
      if ((s & heldMask) === heldValues) continue;
      let t = succ[s]!;
      t = (t & hiLow) | ((t >>> (hi + 1)) << hi);
      basin[attractorOf[(t & loLow) | ((t >>> (lo + 1)) << lo)]!]!++;
    }
    return;
  }
  for (let s = 0; s < succ.length; s++) {
    if ((s & heldMask) === heldValues) continue;
    let t = succ[s]!;
    for (const i of removed) t = (t & ((1 << i) - 1)) | ((t >>> (i + 1)) << i);
    basin[attractorOf[t]!]!++;
  }
}

/** One row: the perturbation's attractors, basins and phenotype share, compared with the context's baseline. */
export function exactScreenRow(
  ctx: ExactScreenContext,
  unit: number,
  perturbation: Assignment,
  options: LongTaskOptions = {},
): ScreenRow {
  const { net, base, baseline } = ctx;
  const n = net.names.length;
  const index = new Map(net.names.map((name, i) => [name, i]));
  const held = new Map<number, 0 | 1>(Object.entries(perturbation).map(([name, v]) => [index.get(name)!, v]));
  let heldMask = 0;
  let heldValues = 0;
  for (const [node, v] of held) {
    heldMask |= 1 << node;
    heldValues |= v << node;
  }
  const { reduced, kept } = substituteHeld(net, held);
  const sub = analyseSynchronous(reduced, options);
  const expand = (r: number) => {
    let s = heldValues;
    for (let q = 0; q < kept.length; q++) s |= ((r >>> q) & 1) << kept[q]!;
    return s >>> 0;
  };
  const basin = Float64Array.from(sub.attractors, (a) => a.basin);
  countOutsideStates(base.successors, sub.attractorOf, heldMask, heldValues, [...held.keys()], basin);
  let phenotypeAttractors = 0;
  let phenotypeBasin = 0;
  let unchanged = 0;
  sub.attractors.forEach((a, q) => {
    const states = Array.from(a.states, expand);
    if (ctx.baseKeys.has(states.join(","))) unchanged++;
    if (hasPattern(readingOfIndices(states, n), ctx.phenotype)) {
      phenotypeAttractors++;
      phenotypeBasin += basin[q]!;
    }
  });
  const basinShare = phenotypeBasin / base.stateCount;
  return {
    unit,
    perturbation,
    basinShare,
    basinShareChange: basinShare - baseline.basinShare!,
    attractorsBefore: baseline.attractors,
    attractorsAfter: sub.attractors.length,
    phenotypeAttractorsBefore: baseline.phenotypeAttractors,
    phenotypeAttractorsAfter: phenotypeAttractors,
    attractorsLost: baseline.attractors - unchanged,
    attractorsGained: sub.attractors.length - unchanged,
    phenotypeFixedPoints: null,
    complete: true,
  };
}
