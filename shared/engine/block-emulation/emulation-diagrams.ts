// Side-by-side space-time diagrams of a block emulation (the picture of "Bulking I", Delorme et al., Theor.
// Comput. Sci. 412, 2011): G's run on a ring, and F's run from the encoded ring sampled every t steps, which must
// decode to G's rows.
import { EngineError } from "../errors";
import type { RuleTable, SpaceTimeDiagram } from "../automata";
import { ecaRule, spaceTimeDiagram, cellsFromString } from "../automata";

export interface EmulationDiagrams {
  readonly target: SpaceTimeDiagram;
  /** F's run from the encoded configuration, one row every `time` steps. */
  readonly emulator: SpaceTimeDiagram;
  readonly block: number;
  readonly time: number;
}

/** The configuration with each cell b replaced by codeword u_b. */
export function encodeConfiguration(config: Uint8Array, u0: string, u1: string): Uint8Array {
  if (u0.length !== u1.length) throw new EngineError("BAD_WORD", "the two codewords must have equal lengths");
  const words = [cellsFromString(u0), cellsFromString(u1)];
  const k = u0.length;
  const out = new Uint8Array(config.length * k);
  for (let i = 0; i < config.length; i++) out.set(words[config[i] ? 1 : 0]!, i * k);
  return out;
}

export function emulationDiagrams(
  emulator: RuleTable,
  target: number,
  witness: { u0: string; u1: string },
  initial: Uint8Array,
  steps: number,
  time = witness.u0.length,
): EmulationDiagrams {
  const k = witness.u0.length;
  return {
    target: spaceTimeDiagram(ecaRule(target), initial, steps),
    emulator: spaceTimeDiagram(emulator, encodeConfiguration(initial, witness.u0, witness.u1), steps * time, time),
    block: k,
    time,
  };
}
