// The server's view of the cellular-automaton engine: symmetry classes and a witness re-checked row by row for
// display, with the verdict taken from the engine's independent verifier (not from the rows computed here).
import { cellsFromString, cellsToString, ecaRule, ecaSymmetryClasses, stepWord } from "@shared/engine/automata";
import { verifyEmulation } from "@shared/engine/block-emulation";
import type { Witness, WitnessCheck } from "@shared/schemas/automata";

let classes: number[][] | null = null;
let classOf: number[][] | null = null;

export function hierarchySymmetryClasses(): number[][] {
  classes ??= ecaSymmetryClasses();
  return classes;
}

export function symmetryClassOf(rule: number): number[] {
  if (!classOf) {
    const table: number[][] = new Array(256);
    for (const c of hierarchySymmetryClasses()) for (const r of c) table[r] = c;
    classOf = table;
  }
  return classOf[rule]!;
}

/** The eight rows of the definition (F run t steps on u_a u_b u_c, middle k cells) and the verifier's verdict. */
export function witnessChecks(
  source: number,
  target: number,
  witness: Witness,
): { verified: boolean; checks: WitnessCheck[] } {
  const rule = ecaRule(source);
  const u = (bit: number) => (bit ? witness.encoding["1"] : witness.encoding["0"]);
  const k = u(0).length;
  const t = witness.time;
  const checks: WitnessCheck[] = [];
  for (let p = 7; p >= 0; p--) {
    const a = (p >> 2) & 1,
      b = (p >> 1) & 1,
      c = p & 1;
    const input = u(a) + u(b) + u(c);
    let cells = cellsFromString(input);
    for (let s = 0; s < t; s++) cells = stepWord(rule, cells);
    const obtained = cellsToString(cells.subarray(k - t, 2 * k - t));
    const expectedBit = ((target >> p) & 1) as 0 | 1;
    const expected = u(expectedBit);
    checks.push({
      neighbourhood: `${a}${b}${c}`,
      expectedBit,
      input,
      expected,
      obtained,
      agrees: obtained === expected,
    });
  }
  const verdict = verifyEmulation(rule, target, u(0), u(1), t);
  return { verified: verdict.valid, checks };
}
