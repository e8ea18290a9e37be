// `coarse-grain <file> --observe A,B [--time t] --json`: do the observed nodes predict themselves t steps ahead? When they
// do, the certificate of the coarse-grained network; either way the size of the coarsest grouping of states that
// refines the observables and is compatible with the dynamics.
import { mergeShards, searchShard } from "../../services/reductions/search-plan";
import { integerOption, parseCommandArgs, printJson, readModelFile, runCommand, UsageError } from "../cli-io";

export const summary = "coarse-grain <file> --observe A,B [--time t] --json: coarse-graining onto observed nodes";
const USAGE = "usage: coarse-grain <model file> --observe A,B,... [--time t (1..8, default 1)] [--json]";

export function run(args: string[]): Promise<number> {
  return runCommand("coarse-grain", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(
      args,
      { observe: { type: "string" }, time: { type: "string" }, json: { type: "boolean" } },
      1,
    );
    const source = await readModelFile(positionals[0]);
    const observe = (values.observe ?? "")
      .split(",")
      .map((s) => s.trim())
      .filter(Boolean);
    if (observe.length === 0) throw new UsageError("--observe needs at least one node name");
    const search = {
      mode: "coarse-grain" as const,
      sourceModelId: "",
      observe,
      time: integerOption(values.time, "--time", 1, 8, 1),
    };
    const result = mergeShards(source, null, search, [searchShard(source, null, search, { range: null }, {})]);
    const out = {
      closes: result.found,
      groups: result.groups,
      ...(result.found ? { witness: result.findings[0]!.certificate } : {}),
    };
    if (values.json) printJson(out);
    else
      process.stdout.write(
        result.found
          ? `the observables close: F coarse-grains onto a ${observe.length}-node network\n`
          : `the observables do not close; the coarsest compatible grouping has ${result.groups} groups\n`,
      );
    return 0;
  });
}
