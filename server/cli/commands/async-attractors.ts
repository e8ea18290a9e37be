// `async-attractors <model file> [--trap-space-limit N] [--json]`: attractors under general asynchronous update for
// models of any size. Up to the exact limit (or when percolation leaves few enough free nodes) the list is proved
// complete; beyond it each minimal trap space small enough is analysed exactly and the rest are reported as holding
// at least one attractor, and the whole list is "found so far" (attractors outside every minimal trap space are not
// excluded).
import {
  asynchronousAttractorReport,
  DEFAULT_ATTRACTOR_TRAP_SPACE_LIMIT,
  MAX_EXACT_FREE_NODES,
} from "@shared/engine/trap-spaces";
import { integerOption, parseCommandArgs, printJson, readModel, runCommand } from "../cli-io";

export const summary =
  "async-attractors <model file> [--trap-space-limit N] [--json]: asynchronous attractors, proved or found so far";

const USAGE = `usage: async-attractors <model file> [--trap-space-limit N (1..100000, default ${DEFAULT_ATTRACTOR_TRAP_SPACE_LIMIT})] [--json]
  exact up to ${MAX_EXACT_FREE_NODES} free nodes; larger models through minimal trap spaces`;

export function run(args: string[]): Promise<number> {
  return runCommand("async-attractors", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(
      args,
      { "trap-space-limit": { type: "string" }, json: { type: "boolean" } },
      1,
    );
    const trapSpaceLimit = integerOption(
      values["trap-space-limit"],
      "--trap-space-limit",
      1,
      100_000,
      DEFAULT_ATTRACTOR_TRAP_SPACE_LIMIT,
    );
    const model = await readModel(positionals[0]);
    for (const w of model.warnings) process.stderr.write(`async-attractors: warning: ${w}\n`);
    const report = asynchronousAttractorReport(model.network, { trapSpaceLimit });
    if (values.json) {
      printJson(report);
      return 0;
    }
    const undecided = report.minimalTrapSpaces.filter((t) => t.verdict === "at least one attractor").length;
    const lines = [
      `${report.nodes.length} nodes; method: ${report.method}; ${report.attractors.length} attractor(s), ${report.completeness}`,
      `${report.minimalTrapSpaces.length} minimal trap space(s)${report.minimalTrapSpacesComplete ? "" : " (list cut by the limit)"}` +
        (undecided ? `, ${undecided} too large to analyse exactly (each holds at least one attractor)` : ""),
      `attractors outside every minimal trap space: ${report.outsideMinimalTrapSpaces}`,
      ...report.attractors.map(
        (a, i) =>
          `${String(i + 1).padStart(4)}  ${a.size === 1 ? "fixed point" : `${a.size} states`}  ${report.nodes.length <= 80 ? a.pattern : `${a.pattern.slice(0, 77)}...`}`,
      ),
    ];
    process.stdout.write(lines.join("\n") + "\n");
    return 0;
  });
}
