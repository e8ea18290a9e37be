// `check <model file> --expectations <table.csv> [--json]`: evaluate every expectation of the table on the model,
// each with the method that fits the model's size, and say which method decided. Exit 1 when any expectation fails
// or the table does not read (every error as file:line:column: reason), 2 for a usage error.
import { EVALUATION_DEFAULTS, evaluateExpectations, parseExpectationsCsv } from "@shared/engine/expectations";
import {
  CommandError,
  UsageError,
  integerOption,
  parseCommandArgs,
  printJson,
  readModel,
  readTextFile,
  runCommand,
} from "../cli-io";

export const summary =
  "check <model file> --expectations <csv> [--json]: pass, fail or undecided for each expectation, and the method";

const USAGE =
  "usage: check <model file (.sbml, .xml, .rules, .txt, .csv)> --expectations <table.csv> [--max-cycle-length L (1..16)] [--json]";

export function run(args: string[]): Promise<number> {
  return runCommand("check", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(
      args,
      { expectations: { type: "string" }, "max-cycle-length": { type: "string" }, json: { type: "boolean" } },
      1,
    );
    const tablePath = values.expectations;
    if (!tablePath) throw new UsageError("--expectations is required");
    const maxCycleLength = integerOption(
      values["max-cycle-length"],
      "--max-cycle-length",
      1,
      16,
      EVALUATION_DEFAULTS.maxCycleLength,
    );
    const model = await readModel(positionals[0]);
    for (const w of model.warnings) process.stderr.write(`check: warning: ${w}\n`);
    const table = parseExpectationsCsv(await readTextFile(tablePath));
    if (table.errors.length > 0) {
      const lines = table.errors.map((e) => `${tablePath}:${e.line}:${e.column}: ${e.reason}`);
      if (table.truncated) lines.push(`(only the first ${table.errors.length} errors are shown)`);
      throw new CommandError(lines.join("\n"));
    }
    const results = evaluateExpectations(model.network, table.expectations, { maxCycleLength });
    for (const r of results)
      if (r.reason === "unknown-node") process.stderr.write(`check: warning: expectation ${r.id}: ${r.detail}\n`);
    const failed = results.filter((r) => r.status === "fail").length;
    if (values.json) printJson({ results });
    else {
      const width = Math.max(2, ...results.map((r) => r.id.length));
      const lines = results.map(
        (r) => `${r.status.toUpperCase().padEnd(9)} ${r.id.padEnd(width)}  ${r.method.padEnd(22)} ${r.detail}`,
      );
      const undecided = results.filter((r) => r.status === "undecided").length;
      lines.push("", `${results.length - failed - undecided} passed, ${failed} failed, ${undecided} undecided`);
      process.stdout.write(lines.join("\n") + "\n");
    }
    return failed > 0 ? 1 : 0;
  });
}
