// `eliminate <model file> (--nodes A,B | --all-eligible | --percolate [--hold A=0,B=1]) [--json]`: a smaller model with
// the same fixed points (node elimination by substitution) or the same attractors (percolation of constants and
// held inputs), printed as rule text with the eliminated nodes and a statement of what the reduction preserves.
import { eliminateNodes, percolateConstants } from "@shared/engine/elimination";
import { networkToDefinition, printRuleText } from "@shared/engine/rules";
import { parseCommandArgs, printJson, readModel, runCommand, UsageError } from "../cli-io";

export const summary =
  "eliminate <file> (--nodes A,B | --all-eligible | --percolate [--hold A=1]) [--json]: a reduced model as rule text";

const USAGE =
  "usage: eliminate <model file> (--nodes A,B,... | --all-eligible | --percolate [--hold A=0,B=1,...]) [--json]";

function names(list: string | undefined): string[] {
  return (list ?? "")
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean);
}

function holds(list: string | undefined): Record<string, 0 | 1> {
  // A Map, so that a node named "__proto__" becomes an own property like any other name.
  const out = new Map<string, 0 | 1>();
  for (const item of names(list)) {
    const m = /^([^=\s]+)\s*=\s*([01])$/.exec(item);
    if (!m) throw new UsageError(`--hold takes NODE=0 or NODE=1 items, got "${item}"`);
    out.set(m[1]!, m[2] === "1" ? 1 : 0);
  }
  return Object.fromEntries(out);
}

export function run(args: string[]): Promise<number> {
  return runCommand("eliminate", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(
      args,
      {
        nodes: { type: "string" },
        "all-eligible": { type: "boolean" },
        percolate: { type: "boolean" },
        hold: { type: "string" },
        json: { type: "boolean" },
      },
      1,
    );
    const modes = [values.nodes !== undefined, values["all-eligible"] === true, values.percolate === true];
    if (modes.filter(Boolean).length !== 1)
      throw new UsageError("give exactly one of --nodes A,B, --all-eligible and --percolate");
    if (values.hold !== undefined && !values.percolate) throw new UsageError("--hold goes with --percolate");
    const chosen = names(values.nodes);
    if (values.nodes !== undefined && chosen.length === 0) throw new UsageError("--nodes needs at least one node name");
    const hold = holds(values.hold);
    const model = await readModel(positionals[0]);
    for (const w of model.warnings) process.stderr.write(`eliminate: warning: ${w}\n`);
    const out = values.percolate
      ? (() => {
          const r = percolateConstants(model.network, hold);
          return { eliminated: r.eliminated, fixed: r.fixed, network: r.network, skipped: [], preserves: r.preserves };
        })()
      : (() => {
          const r = eliminateNodes(model.network, values["all-eligible"] ? "all-eligible" : chosen);
          return {
            eliminated: r.eliminated,
            fixed: {},
            network: r.network,
            skipped: r.skipped,
            preserves: r.preserves,
          };
        })();
    const ruleText = printRuleText(networkToDefinition(out.network));
    if (values.json) {
      printJson({
        eliminated: out.eliminated,
        ...(values.percolate ? { fixed: out.fixed } : { skipped: out.skipped }),
        nodes: out.network.names,
        ruleText,
        preserves: out.preserves,
      });
      return 0;
    }
    const lines = [
      `# ${model.network.names.length} nodes -> ${out.network.names.length}; eliminated: ${out.eliminated.join(", ") || "none"}`,
      ...(values.percolate && out.eliminated.length > 0
        ? [
            `# fixed: ${Object.entries(out.fixed)
              .map(([k, v]) => `${k}=${v}`)
              .join(", ")}`,
          ]
        : []),
      ...out.skipped.map((s) => `# kept ${s.node}: eliminating it would give a node ${s.regulators} regulators`),
      `# preserves: ${out.preserves}`,
    ];
    process.stdout.write(lines.join("\n") + "\n" + ruleText);
    return 0;
  });
}
