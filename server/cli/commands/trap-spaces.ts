// `trap-spaces <model file> [--maximal] [--limit N] [--json]`: the minimal (default) or maximal trap spaces of a model
// by SAT, for networks of thousands of nodes. Each trap space lists only its fixed nodes; a fixed point fixes all of
// them. `complete` is false only when --limit cut the list while more trap spaces exist.
import { MAX_TRAP_SPACE_NODES, trapSpaces } from "@shared/engine/trap-spaces";
import { integerOption, parseCommandArgs, printJson, readModel, runCommand } from "../cli-io";

export const summary =
  "trap-spaces <model file> [--maximal] [--limit N] [--json]: minimal or maximal trap spaces, by SAT (large models)";

const USAGE = `usage: trap-spaces <model file (.sbml, .xml, .rules, .txt, .csv)> [--maximal] [--limit N (1..1000000, default 1000)] [--json]
  up to ${MAX_TRAP_SPACE_NODES} nodes`;

export function run(args: string[]): Promise<number> {
  return runCommand("trap-spaces", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(
      args,
      { maximal: { type: "boolean" }, limit: { type: "string" }, json: { type: "boolean" } },
      1,
    );
    const limit = integerOption(values.limit, "--limit", 1, 1_000_000, 1_000);
    const model = await readModel(positionals[0]);
    for (const w of model.warnings) process.stderr.write(`trap-spaces: warning: ${w}\n`);
    const kind = values.maximal ? "maximal" : "minimal";
    const result = trapSpaces(model.network, { kind, limit });
    if (values.json) {
      printJson({
        nodes: result.nodes,
        kind,
        complete: result.complete,
        trapSpaces: result.trapSpaces.map((t) => ({ fixed: t.fixed })),
      });
      return 0;
    }
    const n = result.nodes.length;
    const lines = [
      `${n} nodes; ${result.trapSpaces.length} ${kind} trap space(s)${result.complete ? "" : ` (the first ${limit}; more exist)`}`,
      ...(kind === "minimal" ? [`${result.percolatedNodes} node(s) fixed by percolation of constants`] : []),
      "('-' marks a free node; a trap space that fixes every node is a fixed point)",
      ...result.trapSpaces.map((t, i) => {
        const free = [...t.pattern].filter((c) => c === "-").length;
        const what = free === 0 ? "fixed point" : `${free} free`;
        return `${String(i + 1).padStart(4)}  ${n <= 80 ? t.pattern : `${t.pattern.slice(0, 77)}...`}  ${what}`;
      }),
    ];
    process.stdout.write(lines.join("\n") + "\n");
    return 0;
  });
}
