// Exact block-emulation search for affine emulators: for a rule that is a XOR of neighbourhood cells plus a
// constant, the block map is affine, M(x,y,z) = Ax + By + Cz + d, so with u1 = u0 + delta every condition of
// "Bulking I" (Delorme et al., Theor. Comput. Sci. 412, 2011) becomes a linear system; only affine targets occur.
import type { MiddleBlockMap } from "./middle-block-map";
import { solveGf2 } from "./gf2-solve";

export interface PackedEmulation {
  readonly target: number;
  readonly u0: number;
  readonly u1: number;
}

function toBits(word: number, k: number): Uint8Array {
  const v = new Uint8Array(k);
  for (let i = 0; i < k; i++) v[i] = (word >>> i) & 1;
  return v;
}

function fromBits(v: Uint8Array, offset = 0, length = v.length - offset): number {
  let w = 0;
  for (let i = 0; i < length; i++) if (v[offset + i]) w |= 1 << i;
  return w;
}

/** The emulations of an affine rule at the map's block size and time, one witness per target. */
export function affineEmulations(map: MiddleBlockMap): PackedEmulation[] {
  const k = map.block;
  const d = map.middle(0, 0, 0);
  const a: number[] = [];
  const b: number[] = [];
  const c: number[] = [];
  for (let i = 0; i < k; i++) {
    a.push(map.middle(1 << i, 0, 0) ^ d);
    b.push(map.middle(0, 1 << i, 0) ^ d);
    c.push(map.middle(0, 0, 1 << i) ^ d);
  }
  // S = A + B + C + I: M(u,u,u) + u = S u + d
  const sCols = a.map((ai, i) => toBits(ai ^ b[i]! ^ c[i]! ^ (1 << i), k));
  const dBits = toBits(d, k);
  const found = new Map<number, PackedEmulation>();
  for (let coeffs = 0; coeffs < 8; coeffs++) {
    const alpha = (coeffs >> 2) & 1;
    const beta = (coeffs >> 1) & 1;
    const gamma = coeffs & 1;
    // delta must satisfy A delta = alpha delta, B delta = beta delta, C delta = gamma delta
    const eigenCols: Uint8Array[] = [];
    for (let i = 0; i < k; i++) {
      const col = new Uint8Array(3 * k);
      col.set(toBits(a[i]! ^ (alpha << i), k), 0);
      col.set(toBits(b[i]! ^ (beta << i), k), k);
      col.set(toBits(c[i]! ^ (gamma << i), k), 2 * k);
      eigenCols.push(col);
    }
    const deltas = solveGf2(eigenCols, new Uint8Array(3 * k)).kernel.map((v) => fromBits(v));
    if (deltas.length === 0) continue;
    for (let g0 = 0; g0 < 2; g0++) {
      // G(a,b,c) = g0 + alpha a + beta b + gamma c; bit p = 4a + 2b + c of the rule number
      let target = 0;
      for (let p = 0; p < 8; p++) target |= (g0 ^ (alpha & (p >> 2)) ^ (beta & (p >> 1)) ^ (gamma & p)) << p;
      if (found.has(target)) continue;
      const witness =
        g0 === 0 ? solveConstantZero(sCols, dBits, deltas[0]!, k) : solveConstantOne(sCols, dBits, deltas, k);
      if (witness) found.set(target, { target, u0: witness[0], u1: witness[1] });
    }
  }
  return [...found.values()];
}

/** S u0 = d with any nonzero delta. */
function solveConstantZero(sCols: Uint8Array[], d: Uint8Array, delta: number, k: number): [number, number] | null {
  const sol = solveGf2(sCols, d).particular;
  if (!sol) return null;
  const u0 = fromBits(sol, 0, k);
  return [u0, u0 ^ delta];
}

/** S u0 + delta = d with delta a nonzero combination of the eigenvector basis. */
function solveConstantOne(sCols: Uint8Array[], d: Uint8Array, deltas: number[], k: number): [number, number] | null {
  const cols = [...sCols, ...deltas.map((v) => toBits(v, k))];
  const { particular, kernel } = solveGf2(cols, d);
  if (!particular) return null;
  const mu = (v: Uint8Array) => v.subarray(k).some((x) => x === 1);
  let sol = particular;
  if (!mu(sol)) {
    const lift = kernel.find(mu);
    if (!lift) return null;
    sol = sol.map((x, i) => x ^ lift[i]!);
  }
  const u0 = fromBits(sol, 0, k);
  let delta = 0;
  for (let j = 0; j < deltas.length; j++) if (sol[k + j]) delta ^= deltas[j]!;
  return [u0, u0 ^ delta];
}
