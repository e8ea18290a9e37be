// `attractors <model file> [--json]`: exact synchronous analysis of a model of up to 24 nodes. With --json, one
// JSON object {"nodes", "stateCount", "attractors": [{"length", "basin", "states"}]}, each cycle from its
// textually smallest state, sorted by basin descending then first state; without it, a readable table.
import { EngineError } from "@shared/engine/errors";
import { analyseSynchronous, attractorsAsText } from "@shared/engine/state-graph";
import { CommandError, parseCommandArgs, printJson, readModel, runCommand } from "../cli-io";

export const summary =
  "attractors <model file> [--json]: every synchronous attractor with its basin size (up to 24 nodes)";

const USAGE = "usage: attractors <model file (.sbml, .xml, .rules, .txt, .csv)> [--json]";

export function run(args: string[]): Promise<number> {
  return runCommand("attractors", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(args, { json: { type: "boolean" } }, 1);
    const input = positionals[0];
    const model = await readModel(input);
    for (const w of model.warnings) process.stderr.write(`attractors: warning: ${w}\n`);
    let analysis;
    try {
      analysis = analyseSynchronous(model.network);
    } catch (err) {
      if (err instanceof EngineError) throw new CommandError(`${input}: ${err.message}`);
      throw err;
    }
    const attractors = attractorsAsText(analysis);
    if (values.json) {
      printJson({ nodes: model.network.names, stateCount: analysis.stateCount, attractors });
      return 0;
    }
    const names = model.network.names;
    const lines = [
      `${names.length} nodes, ${analysis.stateCount} states, ${attractors.length} attractor(s); longest transient ${analysis.maxTransient}, mean ${analysis.meanTransient.toFixed(2)}`,
      `node order: ${names.join(" ")}`,
      "",
      "  #  length       basin  share    states",
    ];
    attractors.forEach((a, i) => {
      const share = `${((100 * a.basin) / analysis.stateCount).toFixed(1)}%`;
      const shown = a.states.length > 8 ? [...a.states.slice(0, 8), `... (${a.states.length - 8} more)`] : a.states;
      lines.push(
        `${String(i + 1).padStart(3)}  ${String(a.length).padStart(6)}  ${String(a.basin).padStart(10)}  ${share.padStart(6)}    ${shown.join(" -> ")}`,
      );
    });
    process.stdout.write(lines.join("\n") + "\n");
    return 0;
  });
}
