// `convert <in> --to sbml|rules|csv`: reads a model file (format by extension: .sbml/.xml, .rules/.txt, .csv) and
// writes it in another format to standard output; read errors go to standard error as file:line:column: reason.
import path from "node:path";
import { EngineError, ParseError } from "@shared/engine/errors";
import { parseRuleText, printRuleText } from "@shared/engine/rules";
import { modelFormatOf, readModelText } from "@shared/formats/read-model";
import { writeSbmlQual } from "@shared/formats/sbml-qual";
import { parseTruthTableCsv, writeTruthTableCsv } from "@shared/formats/truth-table-csv";
import { parseCommandArgs, readModelSource, runCommand, UsageError } from "../cli-io";

export const summary = "convert <in> --to sbml|rules|csv: write a model file in another format to standard output";

const USAGE = "usage: convert <model file (.sbml, .xml, .rules, .txt, .csv)> --to sbml|rules|csv";
const TARGETS = ["sbml", "rules", "csv"] as const;
type Target = (typeof TARGETS)[number];

export function run(args: string[]): Promise<number> {
  return runCommand("convert", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(args, { to: { type: "string" } }, 1);
    const input = positionals[0];
    if (input === undefined) throw new UsageError("the input file is missing");
    const to = values.to;
    if (to === undefined) throw new UsageError("--to is required");
    if (!(TARGETS as readonly string[]).includes(to))
      throw new UsageError(`--to must be sbml, rules or csv, got "${to}"`);
    const text = await readModelSource(input, "input file");
    let model;
    try {
      model = readModelText(input, text);
    } catch (err) {
      if (!(err instanceof EngineError)) throw err;
      // Unlike the other commands, convert lists every error of the file, without the command-name prefix.
      process.stderr.write(describeErrors(input, text, err));
      return 1;
    }
    for (const w of model.warnings) process.stderr.write(`convert: warning: ${w}\n`);
    const base = path.basename(input).replace(/\.[^.]+$/, "");
    const writers: Record<Target, () => string> = {
      sbml: () => writeSbmlQual(model.definition, { modelId: base, modelName: model.modelName ?? base }),
      rules: () => printRuleText(model.definition),
      csv: () => writeTruthTableCsv(model.network),
    };
    process.stdout.write(writers[to as Target]());
    return 0;
  });
}

/** Every error of a rule text or CSV file (the editor's list), or the one error of other readers. */
function describeErrors(file: string, text: string, err: EngineError): string {
  const format = modelFormatOf(file);
  const all: ParseError[] =
    format === "rules" ? parseRuleText(text).errors : format === "csv" ? parseTruthTableCsv(text).errors : [];
  if (all.length > 0) return all.map((e) => `${file}:${e.line}:${e.column}: ${e.reason}\n`).join("");
  if (err instanceof ParseError) return `${file}:${err.line}:${err.column}: ${err.reason}\n`;
  return `${file}: ${err.message}\n`;
}
