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
  const key = (c: Cube) => c.mask * 2 ** 20 + c.value;
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

  // An implicant (mask, value) has the index mask * 2^k + value. Levels never share an index (their masks have
  // different bit counts), so one membership array serves all of them.
  const present = new Uint8Array(1 << (2 * k));
  const combined = new Uint8Array(1 << (2 * k));
  const primes: Cube[] = [];
  let level = minterms.map((m) => (full << k) | m);
  for (const i of level) present[i] = 1;
  while (level.length > 0) {
    const next: number[] = [];
    for (const i of level) {
      const mask = i >>> k;
      const value = i & full;
      for (let b = 1; b <= full; b <<= 1) {
        if (!(mask & b) || value & b) continue;
        const partner = i | b;
        if (!present[partner]) continue;
        combined[i] = 1;
        combined[partner] = 1;
        const merged = ((mask & ~b) << k) | value;
        if (!present[merged]) {
          present[merged] = 1;
          next.push(merged);
        }
      }
    }
    for (const i of level) if (!combined[i]) primes.push({ mask: i >>> k, value: i & full });
    level = next;
  }

  // Rows each prime covers: every assignment of its free variables.
  const coverOf = primes.map((p) => {
    const free = full & ~p.mask;
    const rows: number[] = [];
    for (let sub = free; ; sub = (sub - 1) & free) {
      rows.push(p.value | sub);
      if (sub === 0) break;
    }
    return rows;
  });
  const owners = new Int32Array(1 << k);
  const lastOwner = new Int32Array(1 << k).fill(-1);
  coverOf.forEach((rows, pi) => rows.forEach((r) => (owners[r]!++, (lastOwner[r] = pi))));
  const covered = new Uint8Array(1 << k);
  const chosen: Cube[] = [];
  const choose = (pi: number) => {
    chosen.push(primes[pi]!);
    for (const r of coverOf[pi]!) covered[r] = 1;
  };
  // Essential primes first: the only cover of some row.
  for (const m of minterms) if (owners[m] === 1 && !covered[m]) choose(lastOwner[m]!);
  for (;;) {
    let best = -1;
    let bestCount = 0;
    coverOf.forEach((rows, pi) => {
      let count = 0;
      for (const r of rows) if (!covered[r]) count++;
      if (count > bestCount) {
        best = pi;
        bestCount = count;
      }
    });
    if (best < 0) return chosen;
    choose(best);
  }
}
