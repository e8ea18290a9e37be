// The verifier's own synchronous simulator, 32 states per 32-bit word (bit l of node v's word is v's value in the
// state of lane l), written here from scratch and importing nothing from the searches or the update engine, so that
// a certificate is re-checked by code that cannot share a search's bug (see verify-certificate.ts).

/** Truth tables evaluated on words: a node reads `inputs`; row r of `table` is its value when bit j of r is input j. */
export interface WordNet {
  readonly inputs: readonly (readonly number[])[];
  readonly tables: readonly Uint8Array[];
}

/** Up to this many inputs a table is folded as a multiplexer tree (2^k word operations for 32 states at once). */
const FOLD_MAX_INPUTS = 8;

/** Lane patterns of the five low bits of the lane number: bit j of state (32 b + l) is bit l of LOW_BITS[j]. */
const LOW_BITS = [0xaaaaaaaa | 0, 0xcccccccc | 0, 0xf0f0f0f0 | 0, 0xff00ff00 | 0, 0xffff0000 | 0];

/** Node values of the 32 consecutive states 32 b .. 32 b + 31 (bit j of the state number is node j's value). */
export function laneStates(batch: number, length: number, out: Int32Array): void {
  for (let j = 0; j < length; j++) out[j] = j < 5 ? LOW_BITS[j]! : Math.floor(batch / 2 ** (j - 5)) % 2 ? -1 : 0;
}

export function tableWord(table: Uint8Array, inputs: readonly number[], s: Int32Array, scratch: Int32Array): number {
  const k = inputs.length;
  if (k <= FOLD_MAX_INPUTS) {
    let size = 1 << k;
    for (let r = 0; r < size; r++) scratch[r] = table[r] ? -1 : 0;
    for (let j = k - 1; j >= 0; j--) {
      const x = s[inputs[j]!]!;
      const half = size >> 1;
      for (let r = 0; r < half; r++) scratch[r] = (x & scratch[r + half]!) | (~x & scratch[r]!);
      size = half;
    }
    return scratch[0]!;
  }
  let out = 0;
  for (let lane = 0; lane < 32; lane++) {
    let row = 0;
    for (let j = 0; j < k; j++) row |= ((s[inputs[j]!]! >>> lane) & 1) << j;
    if (table[row]) out |= 1 << lane;
  }
  return out;
}

/** Scratch space big enough for every table of the given nets. */
export function scratchFor(...nets: WordNet[]): Int32Array {
  let k = 0;
  for (const net of nets) for (const ins of net.inputs) k = Math.max(k, Math.min(ins.length, FOLD_MAX_INPUTS));
  return new Int32Array(2 ** k);
}

export function stepWords(net: WordNet, s: Int32Array, out: Int32Array, scratch: Int32Array): void {
  for (let i = 0; i < net.tables.length; i++) out[i] = tableWord(net.tables[i]!, net.inputs[i]!, s, scratch);
}

/** F^t on 32 states at once: `s` is overwritten and the result returned (one of `s`, `spare`). */
export function runWords(net: WordNet, s: Int32Array, spare: Int32Array, t: number, scratch: Int32Array): Int32Array {
  let cur = s;
  let next = spare;
  for (let k = 0; k < t; k++) {
    stepWords(net, cur, next, scratch);
    [cur, next] = [next, cur];
  }
  return cur;
}

/** The 0/1 text of lane `lane`. */
export function laneText(words: Int32Array, length: number, lane: number): string {
  let s = "";
  for (let i = 0; i < length; i++) s += (words[i]! >>> lane) & 1;
  return s;
}

/** Lanes (within `mask`) where the words of a and b differ on some of the first `length` nodes. */
export function differingLanes(a: Int32Array, b: Int32Array, length: number, mask: number): number {
  let diff = 0;
  for (let i = 0; i < length; i++) diff |= a[i]! ^ b[i]!;
  return diff & mask;
}

/** Valid lanes of batch b when there are `count` states in all. */
export function laneMask(batch: number, count: number): number {
  const lanes = Math.min(32, count - 32 * batch);
  return lanes >= 32 ? -1 : (1 << lanes) - 1;
}

export function lowestLane(lanes: number): number {
  return 31 - Math.clz32(lanes & -lanes);
}
