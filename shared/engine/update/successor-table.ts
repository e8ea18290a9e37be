// The synchronous successor of every state of a network of up to 24 nodes, computed 32 states per word:
// inside a block of 32 consecutive states only the low 5 bits vary, so regulators among nodes 0..4 give
// fixed bit patterns and all other regulators are constant; each node's word is looked up from a small
// precomputed table, and a 32x32 bit transpose (Warren, "Hacker's Delight", 2012, section 7-3) turns the
// per-node words into per-state successors.
import { transpose32 } from "../bits";
import { CancelledError, EngineError } from "../errors";
import type { BooleanNetwork } from "../network";
import type { Progress, ShouldStop } from "../progress";

export const MAX_TABLE_NODES = 24;

export interface LongTaskOptions {
  onProgress?: Progress;
  shouldStop?: ShouldStop;
}

/** Per node: its word for each assignment of its regulators outside the low 5 bits. */
interface BlockEvaluator {
  highRegs: Int32Array[];
  words: Uint32Array[];
}

function compileBlockEvaluator(net: BooleanNetwork): BlockEvaluator {
  const n = net.names.length;
  const highRegs: Int32Array[] = [];
  const words: Uint32Array[] = [];
  for (let i = 0; i < n; i++) {
    const regs = net.regulators[i]!;
    const table = net.tables[i]!;
    const highPositions: number[] = [];
    for (let j = 0; j < regs.length; j++) if (regs[j]! >= 5) highPositions.push(j);
    const w = new Uint32Array(1 << highPositions.length);
    for (let h = 0; h < w.length; h++) {
      let rowHigh = 0;
      for (let q = 0; q < highPositions.length; q++) if ((h >> q) & 1) rowHigh |= 1 << highPositions[q]!;
      let word = 0;
      for (let t = 0; t < 32; t++) {
        let row = rowHigh;
        for (let j = 0; j < regs.length; j++) if (regs[j]! < 5) row |= ((t >> regs[j]!) & 1) << j;
        word |= table[row]! << t;
      }
      w[h] = word >>> 0;
    }
    highRegs.push(Int32Array.from(highPositions.map((j) => regs[j]!)));
    words.push(w);
  }
  return { highRegs, words };
}

/**
 * successors[s] = synchronous successor of state s, for all 2^n states (n <= 24).
 * Calls onProgress every 2^16 states and stops with CancelledError when shouldStop() answers true.
 */
export function successorTable(net: BooleanNetwork, options: LongTaskOptions = {}): Uint32Array {
  const n = net.names.length;
  if (n > MAX_TABLE_NODES)
    throw new EngineError(
      "TOO_LARGE",
      `exact state-space analysis supports at most ${MAX_TABLE_NODES} nodes; this network has ${n}`,
    );
  const stateCount = 2 ** n;
  const out = new Uint32Array(stateCount);
  const { highRegs, words } = compileBlockEvaluator(net);
  const block = new Uint32Array(32);
  const blockCount = Math.max(1, stateCount >>> 5);
  const { onProgress, shouldStop } = options;
  for (let b = 0; b < blockCount; b++) {
    if ((b & 2047) === 0 && b > 0) {
      if (shouldStop?.()) throw new CancelledError();
      onProgress?.(b / blockCount, "successors");
    }
    const base = b << 5;
    for (let i = 0; i < n; i++) {
      const hr = highRegs[i]!;
      let h = 0;
      for (let q = 0; q < hr.length; q++) h |= ((base >>> hr[q]!) & 1) << q;
      block[i] = words[i]![h]!;
    }
    for (let i = n; i < 32; i++) block[i] = 0;
    transpose32(block);
    const limit = Math.min(32, stateCount);
    for (let t = 0; t < limit; t++) out[base + t] = block[t]!;
  }
  onProgress?.(1, "successors");
  return out;
}
