// `cycles <model file> --max-length L [--json]`: every fixed point and every synchronous cycle of length up to L, by SAT
// (logic-solver), for networks far beyond the 24 nodes of the exact state-space analysis. No basins: those need the
// whole state space. `complete` is false only when the solution cap cut the enumeration short.
import { satCycles } from "@shared/engine/sat";
import { integerOption, parseCommandArgs, printJson, readModel, runCommand } from "../cli-io";

export const summary =
  "cycles <model file> --max-length L [--json]: all fixed points and cycles up to length L, by SAT (any size)";

const USAGE =
  "usage: cycles <model file (.sbml, .xml, .rules, .txt, .csv)> --max-length L (1..32) [--max-solutions N] [--json]";

export function run(args: string[]): Promise<number> {
  return runCommand("cycles", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(
      args,
      { "max-length": { type: "string" }, "max-solutions": { type: "string" }, json: { type: "boolean" } },
      1,
    );
    const maxLength = integerOption(values["max-length"], "--max-length", 1, 32);
    const maxSolutions = integerOption(values["max-solutions"], "--max-solutions", 1, 1_000_000, 10_000);
    const model = await readModel(positionals[0]);
    for (const w of model.warnings) process.stderr.write(`cycles: warning: ${w}\n`);
    const result = satCycles(model.network, maxLength, { maxSolutions });
    if (values.json) {
      printJson({ nodes: model.network.names, maxLength, complete: result.complete, cycles: result.cycles });
      return 0;
    }
    const lines = [
      `${model.network.names.length} nodes; ${result.cycles.length} cycle(s) of length 1..${maxLength}${result.complete ? "" : " found before the cap (a lower bound)"}`,
      ...result.cycles.map(
        (c, i) =>
          `${String(i + 1).padStart(3)}  length ${String(c.length).padStart(2)}  ${c.states.length > 4 ? [...c.states.slice(0, 4), "..."].join(" -> ") : c.states.join(" -> ")}`,
      ),
    ];
    process.stdout.write(lines.join("\n") + "\n");
    return 0;
  });
}
