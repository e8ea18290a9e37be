// Canonical order of states: states as text are node-ordered 0/1 strings, so comparing their text compares
// node 0 first. That is the numeric order of the bit-reversed index, which is what these helpers compute.

/** Reverse the low `width` bits of `value` (width <= 32). The result orders states as their text does. */
export function reverseBits(value: number, width: number): number {
  let v = value >>> 0;
  v = ((v >>> 1) & 0x55555555) | ((v & 0x55555555) << 1);
  v = ((v >>> 2) & 0x33333333) | ((v & 0x33333333) << 2);
  v = ((v >>> 4) & 0x0f0f0f0f) | ((v & 0x0f0f0f0f) << 4);
  v = ((v >>> 8) & 0x00ff00ff) | ((v & 0x00ff00ff) << 8);
  v = ((v >>> 16) | (v << 16)) >>> 0;
  return width === 0 ? 0 : v >>> (32 - width);
}

/** Compare two state indices of an n-node network by the order of their 0/1 text. */
export function compareStateIndices(a: number, b: number, nodeCount: number): number {
  return reverseBits(a, nodeCount) - reverseBits(b, nodeCount);
}

/** Rotate a cycle (given in dynamics order) so it starts at its textually smallest state. */
export function rotateToSmallest<T>(cycle: readonly T[], less: (a: T, b: T) => boolean): T[] {
  let best = 0;
  for (let i = 1; i < cycle.length; i++) if (less(cycle[i]!, cycle[best]!)) best = i;
  return [...cycle.slice(best), ...cycle.slice(0, best)];
}
