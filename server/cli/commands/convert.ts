// `convert <in> --to sbml|rules|csv`: reads a model file (format by extension: .sbml/.xml, .rules/.txt, .csv) and
// writes it in another format to standard output; read errors go to standard error as file:line:column: reason.
import { readFile } from "node:fs/promises";
import path from "node:path";
import { EngineError, ParseError } from "../../../shared/engine/errors";
import { parseRuleText, printRuleText } from "../../../shared/engine/rules";
import { modelFormatOf, readModelText } from "../../../shared/formats/read-model";
import { writeSbmlQual } from "../../../shared/formats/sbml-qual";
import { parseTruthTableCsv, writeTruthTableCsv } from "../../../shared/formats/truth-table-csv";

export const summary = "convert <in> --to sbml|rules|csv: write a model file in another format to standard output";

const USAGE = "usage: convert <model file (.sbml, .xml, .rules, .txt, .csv)> --to sbml|rules|csv";
const TARGETS = ["sbml", "rules", "csv"] as const;
type Target = (typeof TARGETS)[number];

export async function run(args: string[]): Promise<number> {
  const fail = (msg: string) => {
    process.stderr.write(`convert: ${msg}\n${USAGE}\n`);
    return 2;
  };
  let input: string | undefined;
  let to: string | undefined;
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    if (a === "--to") {
      if (to !== undefined) return fail("--to is given twice");
      to = args[++i];
      if (to === undefined) return fail("--to needs a value");
    } else if (a.startsWith("--")) return fail(`unknown option "${a}"`);
    else if (input === undefined) input = a;
    else return fail(`unexpected argument "${a}"`);
  }
  if (input === undefined) return fail("the input file is missing");
  if (to === undefined) return fail("--to is required");
  if (!(TARGETS as readonly string[]).includes(to)) return fail(`--to must be sbml, rules or csv, got "${to}"`);
  if (!modelFormatOf(input)) return fail(`cannot tell the format of "${input}" from its extension`);

  let text: string;
  try {
    text = await readFile(input, "utf8");
  } catch (err) {
    process.stderr.write(`convert: cannot read ${input}: ${(err as NodeJS.ErrnoException).code ?? String(err)}\n`);
    return 1;
  }
  let model;
  try {
    model = readModelText(input, text);
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
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
  try {
    process.stdout.write(writers[to as Target]());
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    process.stderr.write(`convert: ${err.message}\n`);
    return 1;
  }
  return 0;
}

/** Every error of a rule text or CSV file (the editor's list), or the one error of other readers. */
function describeErrors(file: string, text: string, err: EngineError): string {
  const format = modelFormatOf(file);
  const all: ParseError[] = format === "rules" ? parseRuleText(text).errors : format === "csv" ? parseTruthTableCsv(text).errors : [];
  if (all.length > 0) return all.map((e) => `${file}:${e.line}:${e.column}: ${e.reason}\n`).join("");
  if (err instanceof ParseError) return `${file}:${err.line}:${err.column}: ${err.reason}\n`;
  return `${file}: ${err.message}\n`;
}
