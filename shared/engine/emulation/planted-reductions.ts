// Random networks and planted block emulations for tests and benchmarks: a source built around a random encoding of a
// given target plus noise nodes that keep the context (the planted-solution method of testing search procedures,
// e.g. Achlioptas, Jia, Moore, "Hiding satisfying assignments: two are better than one", JAIR, 2005).
import { EngineError } from "../errors";
import { checkNetwork, type BooleanNetwork } from "../network";
import type { BlockEmulationWitness } from "./block-witness";

/** A seeded generator in the form seedrandom returns: uniform numbers in [0, 1). */
export type Rng = () => number;

const pick = (rng: Rng, k: number) => Math.floor(rng() * k);

function shuffled<T>(rng: Rng, items: readonly T[]): T[] {
  const out = [...items];
  for (let i = out.length - 1; i > 0; i--) {
    const j = pick(rng, i + 1);
    [out[i], out[j]] = [out[j]!, out[i]!];
  }
  return out;
}

/** A random network of n nodes, each with 0..maxInputs distinct regulators and a random table. */
export function randomNetwork(rng: Rng, n: number, maxInputs: number, prefix = "x"): BooleanNetwork {
  const names = Array.from({ length: n }, (_, i) => `${prefix}${i}`);
  const regulators = names.map(() =>
    Int32Array.from(shuffled(rng, [...Array(n).keys()]).slice(0, pick(rng, Math.min(maxInputs, n) + 1))),
  );
  const tables = regulators.map((r) => Uint8Array.from({ length: 1 << r.length }, () => pick(rng, 2)));
  return checkNetwork({ names, regulators, tables });
}

export interface PlantedEmulation {
  readonly source: BooleanNetwork;
  /** The planted witness at time scale 1. */
  readonly witness: BlockEmulationWitness;
}

/**
 * A source of n nodes that emulates `target` at time 1 through a random encoding with blocks of 1..maxBlock nodes;
 * the remaining nodes are noise that reads context nodes and holds its context value on encoded states.
 */
export function plantEmulation(
  rng: Rng,
  target: BooleanNetwork,
  n: number,
  maxBlock: number,
  noiseInputs = 2,
): PlantedEmulation {
  const m = target.names.length;
  const sizes = target.names.map(() => 1 + pick(rng, maxBlock));
  const used = sizes.reduce((a, b) => a + b, 0);
  if (used > n) throw new EngineError("BAD_BOUNDS", `blocks of ${used} nodes do not fit in ${n} source nodes`);
  const order = shuffled(rng, [...Array(n).keys()]);
  const blocks: { nodes: number[]; zero: number[]; one: number[] }[] = [];
  let k = 0;
  for (let j = 0; j < m; j++) {
    const nodes = order.slice(k, k + sizes[j]!).sort((a, b) => a - b);
    k += sizes[j]!;
    const zero = nodes.map(() => pick(rng, 2));
    let one = nodes.map(() => pick(rng, 2));
    if (one.every((b, i) => b === zero[i])) one = one.map((b, i) => (i === 0 ? 1 - b : b));
    blocks.push({ nodes, zero, one });
  }
  const contextNodes = order.slice(k).sort((a, b) => a - b);
  const context = new Array<number>(n).fill(-1);
  for (const v of contextNodes) context[v] = pick(rng, 2);
  // A node of block j where the codewords differ tells target node j's value.
  const reader = blocks.map((b) => {
    const i = b.zero.findIndex((z, q) => z !== b.one[q]);
    return { node: b.nodes[i]!, oneValue: b.one[i]! };
  });
  const regulators: Int32Array[] = new Array(n);
  const tables: Uint8Array[] = new Array(n);
  const noise = (count: number) => shuffled(rng, contextNodes).slice(0, Math.min(count, contextNodes.length));
  blocks.forEach((b, j) => {
    const gRegs = Array.from(target.regulators[j]!);
    b.nodes.forEach((v, pos) => {
      const extra = noise(pick(rng, noiseInputs + 1));
      const regs = [...gRegs.map((r) => reader[r]!.node), ...extra];
      const table = new Uint8Array(1 << regs.length);
      for (let row = 0; row < table.length; row++) {
        const onContext = extra.every((c, q) => ((row >> (gRegs.length + q)) & 1) === context[c]);
        if (!onContext) {
          table[row] = pick(rng, 2);
          continue;
        }
        let gRow = 0;
        gRegs.forEach((r, q) => {
          if (((row >> q) & 1) === reader[r]!.oneValue) gRow |= 1 << q;
        });
        table[row] = target.tables[j]![gRow] ? b.one[pos]! : b.zero[pos]!;
      }
      regulators[v] = Int32Array.from(regs);
      tables[v] = table;
    });
  });
  for (const c of contextNodes) {
    const regs = noise(pick(rng, noiseInputs + 1));
    const table = new Uint8Array(1 << regs.length);
    let home = 0;
    regs.forEach((r, q) => (home |= context[r]! << q));
    for (let row = 0; row < table.length; row++) table[row] = row === home ? context[c]! : pick(rng, 2);
    regulators[c] = Int32Array.from(regs);
    tables[c] = table;
  }
  const names = Array.from({ length: n }, (_, i) => `s${i}`);
  return { source: checkNetwork({ names, regulators, tables }), witness: { time: 1, blocks, context } };
}
