// Population count of a 32-bit word (number of set bits), the SWAR method of Warren, "Hacker's Delight"
// (2nd ed., Addison-Wesley 2012), section 5-1.

export function popcount32(x: number): number {
  let v = x >>> 0;
  v = v - ((v >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  v = (v + (v >>> 4)) & 0x0f0f0f0f;
  return Math.imul(v, 0x01010101) >>> 24;
}
