// Bit-matrix transpose of a 32x32 block held as 32 words (row r = word r, column c = bit c), in place.
// Recursive block-swap method as in Warren, "Hacker's Delight" (2nd ed., Addison-Wesley 2012), section 7-3,
// written for least-significant-bit-first columns.

const MASKS = [0x0000ffff, 0x00ff00ff, 0x0f0f0f0f, 0x33333333, 0x55555555];

/** Transpose words[0..31] in place: afterwards bit c of words[r] is what bit r of words[c] was. */
export function transpose32(words: Uint32Array): void {
  let level = 0;
  for (let j = 16; j !== 0; j >>>= 1, level++) {
    const m = MASKS[level]!;
    for (let k = 0; k < 32; k = (k + j + 1) & ~j) {
      const t = ((words[k]! >>> j) ^ words[k + j]!) & m;
      words[k + j] = words[k + j]! ^ t;
      words[k] = words[k]! ^ (t << j);
    }
  }
}
