// Space-time diagrams of a rule on a ring: row s is the configuration after s synchronous steps, the picture every
// cellular-automaton text draws (e.g. Wolfram, "A New Kind of Science", 2002, ch. 2).
import { EngineError } from "../errors";
import type { RuleTable } from "./rule-table";
import { stepRing } from "./step-cells";

export interface SpaceTimeDiagram {
  readonly width: number;
  readonly steps: number;
  /** (steps + 1) rows of `width` cells, row-major. */
  readonly cells: Uint8Array;
}

/** The diagram of `steps` steps from `initial` on a ring, keeping every `every`-th row (row 0 always). */
export function spaceTimeDiagram(rule: RuleTable, initial: Uint8Array, steps: number, every = 1): SpaceTimeDiagram {
  if (!Number.isInteger(steps) || steps < 0)
    throw new EngineError("BAD_ARGUMENT", `steps is a non-negative integer, got ${steps}`);
  if (!Number.isInteger(every) || every < 1)
    throw new EngineError("BAD_ARGUMENT", `every is a positive integer, got ${every}`);
  const width = initial.length;
  const rows = Math.floor(steps / every);
  const cells = new Uint8Array((rows + 1) * width);
  cells.set(initial, 0);
  let current = initial;
  for (let s = 1; s <= rows * every; s++) {
    current = stepRing(rule, current);
    if (s % every === 0) cells.set(current, (s / every) * width);
  }
  return { width, steps: rows, cells };
}
