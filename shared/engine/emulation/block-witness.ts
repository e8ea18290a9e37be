// Block emulation between Boolean networks: each target node j is carried by a block of source nodes with two
// distinct codewords, all other source nodes hold a fixed context; the cellular-automaton notion of block
// emulation (Ollinger, "Intrinsic universality and cellular automata", Theoretical Computer Science, 2003) carried to networks.
import { EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import { iterateValues } from "./network-step";

export interface EmulationBlock {
  /** Source node indices, ascending. */
  readonly nodes: readonly number[];
  /** Values of the block's nodes (same order) encoding target value 0, and value 1. */
  readonly zero: readonly number[];
  readonly one: readonly number[];
}

export interface BlockEmulationWitness {
  readonly time: number;
  /** blocks[j] carries target node j. */
  readonly blocks: readonly EmulationBlock[];
  /** One entry per source node: its fixed value 0/1 when it is a context node, -1 when it lies in a block. */
  readonly context: readonly number[];
}

/** The encoded source state e(x) of target state x, as one byte per source node. */
export function encodeTargetState(witness: BlockEmulationWitness, x: number): Uint8Array {
  const values = new Uint8Array(witness.context.length);
  for (let v = 0; v < values.length; v++) values[v] = witness.context[v]! === 1 ? 1 : 0;
  witness.blocks.forEach((b, j) => {
    const word = (x >>> j) & 1 ? b.one : b.zero;
    b.nodes.forEach((v, i) => (values[v] = word[i]!));
  });
  return values;
}

/** Structural sanity: disjoint non-empty blocks, distinct codewords, context exactly outside the blocks. */
export function checkWitnessShape(n: number, m: number, w: BlockEmulationWitness): void {
  if (w.blocks.length !== m) throw new EngineError("BAD_WITNESS", `expected ${m} blocks, got ${w.blocks.length}`);
  if (w.context.length !== n)
    throw new EngineError("BAD_WITNESS", `expected a context entry for each of ${n} source nodes`);
  const owner = new Int32Array(n).fill(-1);
  w.blocks.forEach((b, j) => {
    if (b.nodes.length === 0) throw new EngineError("BAD_WITNESS", `block ${j} is empty`);
    if (b.zero.length !== b.nodes.length || b.one.length !== b.nodes.length)
      throw new EngineError("BAD_WITNESS", `block ${j} has codewords of the wrong length`);
    if (b.zero.every((z, i) => z === b.one[i])) throw new EngineError("BAD_WITNESS", `block ${j} has equal codewords`);
    for (const v of b.nodes) {
      if (owner[v]! !== -1) throw new EngineError("BAD_WITNESS", `source node ${v} lies in two blocks`);
      owner[v] = j;
    }
  });
  for (let v = 0; v < n; v++) {
    const inBlock = owner[v]! !== -1;
    if (inBlock !== (w.context[v]! === -1))
      throw new EngineError("BAD_WITNESS", `source node ${v} must be either in a block or in the context`);
  }
}

/** Does the witness show F^t(e(x)) = e(G(x)) for every target state x? (`targetSucc` is G's successor table.) */
export function witnessHolds(source: BooleanNetwork, targetSucc: ArrayLike<number>, w: BlockEmulationWitness): boolean {
  checkWitnessShape(source.names.length, w.blocks.length, w);
  for (let x = 0; x < targetSucc.length; x++) {
    const image = iterateValues(source, encodeTargetState(w, x), w.time);
    const expected = encodeTargetState(w, targetSucc[x]!);
    for (let v = 0; v < image.length; v++) if (image[v] !== expected[v]) return false;
  }
  return true;
}
