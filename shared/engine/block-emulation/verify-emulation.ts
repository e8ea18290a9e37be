// Independent check of a block-emulation witness by direct simulation, straight from the definition in
// "Bulking I" (Delorme et al., Theor. Comput. Sci. 412, 2011): for each of the 8 triples, run F for t steps on
// u_a u_b u_c cell by cell and compare the middle k cells with u_G(a,b,c). Shares no code with the searches.
import { EngineError } from "../errors";
import type { RuleTable } from "../automata";

export interface EmulationCheck {
  readonly valid: boolean;
  /** The triples (as "abc") whose middle block is not the expected codeword, with what was found. */
  readonly failures: { triple: string; expected: string; found: string }[];
}

function parseWord(text: string): number[] {
  const cells: number[] = [];
  for (const ch of text) {
    if (ch !== "0" && ch !== "1") throw new EngineError("BAD_WORD", `a codeword is made of 0 and 1, got "${text}"`);
    cells.push(ch === "1" ? 1 : 0);
  }
  return cells;
}

/** Whether `rule` emulates elementary rule `target` with codewords u0, u1 at time `time` (default: their length). */
export function verifyEmulation(
  rule: RuleTable,
  target: number,
  u0: string,
  u1: string,
  time = u0.length,
): EmulationCheck {
  const k = u0.length;
  const r = rule.radius;
  if (k === 0 || u1.length !== k)
    throw new EngineError("BAD_WORD", "the two codewords must be non-empty and of equal length");
  if (u0 === u1) return { valid: false, failures: [{ triple: "---", expected: "two distinct codewords", found: u0 }] };
  if (!Number.isInteger(time) || time < 1 || r * time > k)
    throw new EngineError("BAD_TIME", `time ${time} with radius ${r} does not fit block ${k}`);
  const words = [parseWord(u0), parseWord(u1)];
  const failures: EmulationCheck["failures"] = [];
  for (let a = 0; a < 2; a++) {
    for (let b = 0; b < 2; b++) {
      for (let c = 0; c < 2; c++) {
        let cells = [...words[a]!, ...words[b]!, ...words[c]!];
        for (let s = 0; s < time; s++) {
          const next: number[] = [];
          for (let i = r; i < cells.length - r; i++) {
            let index = 0;
            for (let j = i - r; j <= i + r; j++) index = 2 * index + cells[j]!;
            next.push(rule.table[index]!);
          }
          cells = next;
        }
        // after t steps the word starts r*t cells to the right of the original start
        const offset = k - r * time;
        const middle = cells.slice(offset, offset + k).join("");
        const g = (target >> (4 * a + 2 * b + c)) & 1;
        const expected = g ? u1 : u0;
        if (middle !== expected) failures.push({ triple: `${a}${b}${c}`, expected, found: middle });
      }
    }
  }
  return { valid: failures.length === 0, failures };
}
