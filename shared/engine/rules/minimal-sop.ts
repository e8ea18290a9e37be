// Two-level (sum of products) form of a truth table: prime implicants by the Quine-McCluskey method
// (McCluskey, "Minimization of Boolean functions", Bell System Technical Journal 1956), covered by essential primes
// then greedily; wide tables are first split by Shannon expansion so the work stays bounded. The cover is exact.

/** A product term: variables in `mask` appear, with the polarity given by the same bits of `value`. */
export interface Cube {
  readonly mask: number;
  readonly value: number;
}

const QM_LIMIT = 10;

/** An exact sum-of-products cover of a table with k inputs (row bit j = input j). Empty cover = constant 0. */
export function minimalSop(table: Uint8Array, k: number): Cube[] {
  if (k > QM_LIMIT) return shannon(table, k);
  return quineMcCluskey(table, k);
}

function shannon(table: Uint8Array, k: number): Cube[] {
  const half = 1 << (k - 1);
  const f0 = table.subarray(0, half);
  const f1 = table.subarray(half);
  const c0 = minimalSop(f0, k - 1);
  if (f0.every((v, i) => v === f1[i])) return c0;
  const c1 = minimalSop(f1, k - 1);
  const bit = half;
  const key = (c: Cube) => `${c.mask}:${c.value}`;
  const in1 = new Set(c1.map(key));
  const shared = new Set(c0.filter((c) => in1.has(key(c))).map(key));
  // A cube found in both halves does not depend on the split variable.
  return [
    ...c0.map((c) => (shared.has(key(c)) ? c : { mask: c.mask | bit, value: c.value })),
    ...c1.filter((c) => !shared.has(key(c))).map((c) => ({ mask: c.mask | bit, value: c.value | bit })),
  ];
}

function quineMcCluskey(table: Uint8Array, k: number): Cube[] {
  const full = (1 << k) - 1;
  const minterms: number[] = [];
  for (let row = 0; row < table.length; row++) if (table[row]) minterms.push(row);
  if (minterms.length === 0) return [];
  if (minterms.length === table.length) return [{ mask: 0, value: 0 }];

  // Implicants as (free-variable mask, value); combine pairs that differ in one cared-for bit.
  const primes: Cube[] = [];
  let level = new Map<string, Cube>();
  for (const m of minterms) level.set(`${full}:${m}`, { mask: full, value: m });
  while (level.size > 0) {
    const next = new Map<string, Cube>();
    const combined = new Set<string>();
    for (const [k1, c] of level) {
      for (let b = 1; b <= full; b <<= 1) {
        if (!(c.mask & b) || c.value & b) continue;
        const partner = `${c.mask}:${c.value | b}`;
        if (!level.has(partner)) continue;
        combined.add(k1);
        combined.add(partner);
        const merged = { mask: c.mask & ~b, value: c.value };
        next.set(`${merged.mask}:${merged.value}`, merged);
      }
    }
    for (const [key, c] of level) if (!combined.has(key)) primes.push(c);
    level = next;
  }

  const covers = (c: Cube, m: number) => (m & c.mask) === c.value;
  const uncovered = new Set(minterms);
  const chosen: Cube[] = [];
  for (const m of minterms) {
    const owners = primes.filter((p) => covers(p, m));
    if (owners.length === 1 && !chosen.includes(owners[0]!)) chosen.push(owners[0]!);
  }
  for (const c of chosen) for (const m of minterms) if (covers(c, m)) uncovered.delete(m);
  while (uncovered.size > 0) {
    let best = primes[0]!;
    let bestCount = -1;
    for (const p of primes) {
      let count = 0;
      for (const m of uncovered) if (covers(p, m)) count++;
      if (count > bestCount) {
        best = p;
        bestCount = count;
      }
    }
    chosen.push(best);
    for (const m of [...uncovered]) if (covers(best, m)) uncovered.delete(m);
  }
  return chosen;
}
