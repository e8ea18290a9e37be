// Covers of the rows where a truth table takes a given value, as cubes (partial assignments of its inputs). A cover
// of f = 1 and one of f = 0 together give the clause form of x' <-> f(x) without auxiliary variables, which is what
// the fixed-point, trap-space and closure encodings feed to MiniSat. Narrow tables use the prime implicants that
// minimalSop picks (Quine-McCluskey); wide ones are first split by Shannon expansion on their top input, dropping
// inputs on which a half does not depend, so the work stays linear in the table size.
import { minimalSop, type Cube } from "../rules";

// Below this width minimalSop's implicant arrays (4^k bytes) are small; above it they would dominate.
const PRIME_WIDTH = 6;

/** Cubes whose union is exactly the set of rows r with table[r] === value (row bit j = input j). */
export function tableCubes(table: Uint8Array, inputCount: number, value: 0 | 1): Cube[] {
  const out: Cube[] = [];
  collect(table, inputCount, value, 0, 0, out);
  return out;
}

function collect(table: Uint8Array, k: number, value: 0 | 1, mask: number, bits: number, out: Cube[]): void {
  let hits = 0;
  for (let r = 0; r < table.length; r++) if (table[r] === value) hits++;
  if (hits === 0) return;
  if (hits === table.length) {
    out.push({ mask, value: bits });
    return;
  }
  if (k <= PRIME_WIDTH) {
    const target = value === 1 ? table : table.map((b) => 1 - b);
    for (const c of minimalSop(target, k)) out.push({ mask: mask | c.mask, value: bits | c.value });
    return;
  }
  const half = 1 << (k - 1);
  const low = table.subarray(0, half);
  const high = table.subarray(half);
  const top = 1 << (k - 1);
  if (low.every((b, r) => b === high[r])) {
    collect(low, k - 1, value, mask, bits, out);
    return;
  }
  collect(low, k - 1, value, mask | top, bits, out);
  collect(high, k - 1, value, mask | top, bits | top, out);
}
