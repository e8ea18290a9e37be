// `attractors <model file> [--json]`: exact synchronous analysis of a model of up to 24 nodes. With --json, one
// JSON object {"nodes", "stateCount", "attractors": [{"length", "basin", "states"}]}, each cycle from its
// textually smallest state, sorted by basin descending then first state; without it, a readable table.
import { readFile } from "node:fs/promises";
import { EngineError, ParseError } from "../../../shared/engine/errors";
import { analyseSynchronous, attractorsAsText } from "../../../shared/engine/state-graph";
import { modelFormatOf, readModelText } from "../../../shared/formats/read-model";

export const summary = "attractors <model file> [--json]: every synchronous attractor with its basin size (up to 24 nodes)";

const USAGE = "usage: attractors <model file (.sbml, .xml, .rules, .txt, .csv)> [--json]";

export async function run(args: string[]): Promise<number> {
  const fail = (msg: string) => {
    process.stderr.write(`attractors: ${msg}\n${USAGE}\n`);
    return 2;
  };
  let input: string | undefined;
  let json = false;
  for (const a of args) {
    if (a === "--json") json = true;
    else if (a.startsWith("--")) return fail(`unknown option "${a}"`);
    else if (input === undefined) input = a;
    else return fail(`unexpected argument "${a}"`);
  }
  if (input === undefined) return fail("the model file is missing");
  if (!modelFormatOf(input)) return fail(`cannot tell the format of "${input}" from its extension`);
  let text: string;
  try {
    text = await readFile(input, "utf8");
  } catch (err) {
    process.stderr.write(`attractors: cannot read ${input}: ${(err as NodeJS.ErrnoException).code ?? String(err)}\n`);
    return 1;
  }
  try {
    const model = readModelText(input, text);
    for (const w of model.warnings) process.stderr.write(`attractors: warning: ${w}\n`);
    const analysis = analyseSynchronous(model.network);
    const attractors = attractorsAsText(analysis);
    if (json) {
      process.stdout.write(JSON.stringify({ nodes: model.network.names, stateCount: analysis.stateCount, attractors }) + "\n");
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
      lines.push(`${String(i + 1).padStart(3)}  ${String(a.length).padStart(6)}  ${String(a.basin).padStart(10)}  ${share.padStart(6)}    ${shown.join(" -> ")}`);
    });
    process.stdout.write(lines.join("\n") + "\n");
    return 0;
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    const where = err instanceof ParseError ? `${input}:${err.line}:${err.column}: ${err.reason}` : `${input}: ${err.message}`;
    process.stderr.write(`attractors: ${where}\n`);
    return 1;
  }
}
