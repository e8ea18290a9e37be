// One-dimensional binary cellular automata on a ring of N cells as Boolean networks, numbered by the standard rule
// number (Wolfram, "Statistical mechanics of cellular automata", Reviews of Modern Physics 55, 1983): the next value
// of a cell is bit v of the rule number, where v reads the neighbourhood left to right as a binary number.
import { EngineError } from "../errors";
import { checkNetwork, type BooleanNetwork } from "../network";

export interface CellularAutomatonOptions {
  /** Number of cells on the ring. */
  readonly cells: number;
  /** Rule number in 0 .. 2^(2^(2r+1)) - 1; a bigint for radius 3 and more, where numbers lose precision. */
  readonly rule: number | bigint;
  /** Neighbourhood radius r (1 for elementary cellular automata). */
  readonly radius?: number;
}

/**
 * The ring automaton as a network: nodes c0..c{N-1}; cell i reads cells i-r .. i+r (mod N) in that order, so
 * regulator j is the (j+1)-th cell from the left and carries weight 2^(2r-j) in the neighbourhood number.
 */
export function cellularAutomaton({ cells, rule, radius = 1 }: CellularAutomatonOptions): BooleanNetwork {
  if (!Number.isInteger(radius) || radius < 0)
    throw new EngineError("BAD_ARGUMENT", `radius must be a non-negative integer, got ${radius}`);
  const width = 2 * radius + 1;
  if (width > 20)
    throw new EngineError(
      "BAD_ARGUMENT",
      `radius ${radius} gives ${width} regulators per cell; at most 20 are supported`,
    );
  if (!Number.isInteger(cells) || cells < width) {
    throw new EngineError(
      "BAD_ARGUMENT",
      `a ring of radius ${radius} needs at least ${width} cells so that neighbours are distinct, got ${cells}`,
    );
  }
  if (typeof rule === "number" && (!Number.isSafeInteger(rule) || rule < 0))
    throw new EngineError("BAD_ARGUMENT", `rule number must be a non-negative integer, got ${rule}`);
  const ruleBits = BigInt(rule);
  const rows = 1 << width;
  if (ruleBits < 0n || ruleBits >= 1n << BigInt(rows)) {
    throw new EngineError(
      "BAD_ARGUMENT",
      `rule number ${rule} is out of range for radius ${radius} (0 to 2^${rows} - 1)`,
    );
  }
  // One shared table: row bit j is the cell at offset j - r, whose weight in the neighbourhood number is 2^(2r - j).
  const table = new Uint8Array(rows);
  for (let row = 0; row < rows; row++) {
    let v = 0;
    for (let j = 0; j < width; j++) if ((row >> j) & 1) v += 1 << (width - 1 - j);
    table[row] = Number((ruleBits >> BigInt(v)) & 1n);
  }
  const names = Array.from({ length: cells }, (_, i) => `c${i}`);
  const regulators = names.map((_, i) =>
    Int32Array.from({ length: width }, (_, j) => (((i + j - radius) % cells) + cells) % cells),
  );
  return checkNetwork({ names, regulators, tables: names.map(() => table.slice()) });
}
