// A node's truth table as a propositional formula for the SAT solver, by Shannon expansion on its last regulator
// (Shannon, "The synthesis of two-terminal switching circuits", Bell System Technical Journal 1949), skipping
// regulators that the table does not depend on in the current branch.
import Logic from "logic-solver";

type Formula = ReturnType<typeof Logic.and>;

/** Formula of `table` where row bit j is the value of the variable named inputs[j]. */
export function tableFormula(table: Uint8Array, inputs: readonly string[]): Formula {
  const expand = (offset: number, k: number): Formula => {
    const size = 1 << k;
    let ones = 0;
    for (let r = offset; r < offset + size; r++) ones += table[r]!;
    if (ones === 0) return Logic.FALSE;
    if (ones === size) return Logic.TRUE;
    const half = size >> 1;
    let same = true;
    for (let r = 0; r < half && same; r++) same = table[offset + r] === table[offset + half + r];
    if (same) return expand(offset, k - 1);
    const v = inputs[k - 1]!;
    return Logic.or(Logic.and(v, expand(offset + half, k - 1)), Logic.and(Logic.not(v), expand(offset, k - 1)));
  };
  return expand(0, inputs.length);
}
