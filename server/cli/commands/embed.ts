// `embed --source F --target G [--time t] --json`: is there a one-to-one map e with F^t(e(x)) = e(G(x)) for some time
// scale 1..t? Exact for sources up to 20 nodes. Same output shape as `emulate`.
import { mergeShards, searchShard } from "../../services/reductions/search-plan";
import { integerOption, parseCommandArgs, printJson, readModelFile, runCommand } from "../cli-io";

export const summary = "embed --source F --target G [--time t] --json: dynamical embedding of G into F";
const USAGE = "usage: embed --source <model file> --target <model file> [--time t (1..8, default 1)] [--json]";

export function run(args: string[]): Promise<number> {
  return runCommand("embed", USAGE, async () => {
    const { values } = parseCommandArgs(args, {
      source: { type: "string" },
      target: { type: "string" },
      time: { type: "string" },
      json: { type: "boolean" },
    });
    const source = await readModelFile(values.source, "--source model file");
    const target = await readModelFile(values.target, "--target model file");
    const search = {
      mode: "given-target" as const,
      notion: "dynamical-embedding" as const,
      sourceModelId: "",
      targetModelId: "",
      maxTime: integerOption(values.time, "--time", 1, 8, 1),
    };
    const result = mergeShards(source, target, search, [searchShard(source, target, search, { range: null }, {})]);
    const out = result.found
      ? { found: true, witness: result.findings[0]!.certificate }
      : { found: false, bounds: { maxTime: search.maxTime } };
    if (values.json) printJson(out);
    else
      process.stdout.write(
        result.found
          ? `G embeds into F at time scale ${result.findings[0]!.certificate.time}\n`
          : `no embedding for time scales 1..${search.maxTime}\n`,
      );
    return 0;
  });
}
