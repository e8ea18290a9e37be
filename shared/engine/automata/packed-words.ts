// Words of cells packed into integers, bit i holding cell i (leftmost cell = least significant bit, common practice
// in bit-parallel simulation), and their text form as '0'/'1' characters leftmost first, as the engine prints them.
import { EngineError } from "../errors";

/** The most cells a packed word holds; bitwise operators work on 32-bit integers. */
export const MAX_PACKED_CELLS = 30;

export function packedToString(word: number, length: number): string {
  let s = "";
  for (let i = 0; i < length; i++) s += (word >>> i) & 1 ? "1" : "0";
  return s;
}

export function packedFromString(text: string): number {
  if (text.length > MAX_PACKED_CELLS)
    throw new EngineError("BAD_WORD", `a packed word holds at most ${MAX_PACKED_CELLS} cells`);
  let w = 0;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === "1") w |= 1 << i;
    else if (ch !== "0") throw new EngineError("BAD_WORD", `a word is made of 0 and 1, got "${text}"`);
  }
  return w;
}

export function cellsFromString(text: string): Uint8Array {
  const cells = new Uint8Array(text.length);
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === "1") cells[i] = 1;
    else if (ch !== "0") throw new EngineError("BAD_WORD", `a word is made of 0 and 1, got "${text}"`);
  }
  return cells;
}

export function cellsToString(cells: ArrayLike<number>): string {
  let s = "";
  for (let i = 0; i < cells.length; i++) s += cells[i] ? "1" : "0";
  return s;
}

export function reverseString(text: string): string {
  return [...text].reverse().join("");
}

export function complementString(text: string): string {
  let s = "";
  for (const ch of text) s += ch === "1" ? "0" : "1";
  return s;
}
