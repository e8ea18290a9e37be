// `emulate --source F --target G [--time t] [--max-block b] [--no-context] --json`: does F block-emulate G at some time
// scale 1..t with blocks of at most b nodes? Prints {"found":true,"witness":certificate} or {"found":false,"bounds":{...}}.
import { mergeShards, searchShard } from "../../services/reductions/search-plan";
import { integerOption, parseCommandArgs, printJson, readModelFile, runCommand } from "../cli-io";

export const summary =
  "emulate --source F --target G [--time t] [--max-block b] [--no-context] --json: block emulation of G by F";
const USAGE =
  "usage: emulate --source <model file> --target <model file> [--time t (1..8, default 1)] [--max-block b (1..6, default 3)] [--no-context] [--json]";

export function run(args: string[]): Promise<number> {
  return runCommand("emulate", USAGE, async () => {
    const { values } = parseCommandArgs(args, {
      source: { type: "string" },
      target: { type: "string" },
      time: { type: "string" },
      "max-block": { type: "string" },
      "no-context": { type: "boolean" },
      json: { type: "boolean" },
    });
    const source = await readModelFile(values.source, "--source model file");
    const target = await readModelFile(values.target, "--target model file");
    const search = {
      mode: "given-target" as const,
      notion: "block-emulation" as const,
      sourceModelId: "",
      targetModelId: "",
      maxTime: integerOption(values.time, "--time", 1, 8, 1),
      maxBlock: integerOption(values["max-block"], "--max-block", 1, 6, 3),
      allowContext: !values["no-context"],
    };
    const result = mergeShards(source, target, search, [searchShard(source, target, search, { range: null }, {})]);
    const bounds = { maxTime: search.maxTime, maxBlock: search.maxBlock, contextAllowed: search.allowContext };
    const out = result.found ? { found: true, witness: result.findings[0]!.certificate } : { found: false, bounds };
    if (values.json) printJson(out);
    else
      process.stdout.write(
        result.found
          ? `F emulates G at time scale ${result.findings[0]!.certificate.time}\n`
          : `no block emulation within ${JSON.stringify(bounds)}\n`,
      );
    return 0;
  });
}
