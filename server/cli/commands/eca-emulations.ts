// `eca-emulations --rule F --block k [--time t] [--json]`: every elementary rule that F emulates at block size k and
// time t (default k), one witness each, targets ascending, codewords leftmost cell first.
import { ecaRule } from "@shared/engine/automata";
import { blockEmulations, MAX_SEARCH_BLOCK } from "@shared/engine/block-emulation";
import { integerOption, parseCommandArgs, printJson, runCommand } from "../cli-io";

export const summary = "elementary rules emulated by --rule F at --block k [--time t] [--json]";

const USAGE = "usage: eca-emulations --rule F (0..255) --block k (1..20) [--time t (1..k)] [--json]";

export function run(args: string[]): Promise<number> {
  return runCommand("eca-emulations", USAGE, async () => {
    const { values } = parseCommandArgs(
      args,
      { rule: { type: "string" }, block: { type: "string" }, time: { type: "string" }, json: { type: "boolean" } },
      0,
    );
    const rule = integerOption(values.rule, "--rule", 0, 255);
    const block = integerOption(values.block, "--block", 1, MAX_SEARCH_BLOCK);
    const time = integerOption(values.time, "--time", 1, block, block);
    const result = blockEmulations(ecaRule(rule), block, time);
    if (values.json) {
      printJson({
        rule,
        block,
        time,
        emulations: result.emulations.map((e) => ({ target: e.target, encoding: { "0": e.u0, "1": e.u1 } })),
      });
    } else {
      const lines = [`rule ${rule}, block ${block}, time ${time}: ${result.emulations.length} emulated rule(s)`];
      for (const e of result.emulations) lines.push(`  ${String(e.target).padStart(3)}  0 -> ${e.u0}  1 -> ${e.u1}`);
      process.stdout.write(lines.join("\n") + "\n");
    }
    return 0;
  });
}
