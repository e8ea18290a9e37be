// `discover <file> --max-target-nodes m [--time t] [--max-block b] --json`: every smaller network (1..m nodes) the model
// block-emulates within the bounds, up to renaming and codeword swaps, ranked, trivial ones flagged.
import { mergeShards, searchShard } from "../../services/reductions/search-plan";
import { integerOption, parseCommandArgs, printJson, readModelFile, runCommand } from "../cli-io";

export const summary =
  "discover <file> --max-target-nodes m [--time t] [--max-block b] --json: smaller networks the model emulates";
const USAGE =
  "usage: discover <model file> --max-target-nodes m (1..4) [--time t (1..8, default 1)] [--max-block b (1..4, default 2)] [--no-context] [--json]";

export function run(args: string[]): Promise<number> {
  return runCommand("discover", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(
      args,
      {
        "max-target-nodes": { type: "string" },
        time: { type: "string" },
        "max-block": { type: "string" },
        "no-context": { type: "boolean" },
        json: { type: "boolean" },
      },
      1,
    );
    const source = await readModelFile(positionals[0]);
    const search = {
      mode: "discover" as const,
      sourceModelId: "",
      maxTargetNodes: integerOption(values["max-target-nodes"], "--max-target-nodes", 1, 4),
      maxTime: integerOption(values.time, "--time", 1, 8, 1),
      maxBlock: integerOption(values["max-block"], "--max-block", 1, 4, 2),
      allowContext: !values["no-context"],
    };
    const result = mergeShards(source, null, search, [searchShard(source, null, search, { range: null }, {})]);
    const targets = result.findings.map((f) => ({
      nodes: f.certificate.target.nodes.length,
      time: f.certificate.time,
      flags: f.flags,
      witness: f.certificate,
    }));
    if (values.json) printJson({ distinctTargets: result.distinctTargets, targets });
    else {
      const lines = [`${result.distinctTargets} distinct target(s); best ${targets.length}:`];
      for (const t of targets)
        lines.push(
          `  ${t.nodes} node(s), t=${t.time}${t.flags.length ? ` [${t.flags.join(", ")}]` : ""}: ${t.witness.target.nodes.map((n) => `${n.name}(${n.inputs.join(",")})=${n.table}`).join("  ")}`,
        );
      process.stdout.write(lines.join("\n") + "\n");
    }
    return 0;
  });
}
