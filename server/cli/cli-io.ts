// What every command shares: option parsing (node's util.parseArgs, strict), integer checks with ranges, reading a
// model file of any format with errors as file:line:column: reason, and the exit codes (2 usage, 1 failure).
import { readFile } from "node:fs/promises";
import { parseArgs, type ParseArgsConfig } from "node:util";
import { EngineError, ParseError } from "@shared/engine/errors";
import type { BooleanNetwork } from "@shared/engine/network";
import { modelFormatOf, readModelText, type ReadModelResult } from "@shared/formats/read-model";

export class UsageError extends Error {}
export class CommandError extends Error {}

export type Options = NonNullable<ParseArgsConfig["options"]>;

/** Strict parsing; an option given twice and more than `maxPositionals` positional arguments are usage errors. */
export function parseCommandArgs<O extends Options>(args: string[], options: O, maxPositionals = Infinity) {
  let parsed;
  try {
    parsed = parseArgs({ args, options, allowPositionals: true, strict: true, tokens: true });
  } catch (err) {
    throw new UsageError((err as Error).message.replace(/\. To specify a positional.*$/s, ""));
  }
  const seen = new Set<string>();
  for (const token of parsed.tokens) {
    if (token.kind !== "option" || options[token.name]?.multiple) continue;
    if (seen.has(token.name)) throw new UsageError(`${token.rawName} is given twice`);
    seen.add(token.name);
  }
  if (parsed.positionals.length > maxPositionals)
    throw new UsageError(`unexpected argument "${parsed.positionals[maxPositionals]}"`);
  return { values: parsed.values, positionals: parsed.positionals };
}

export function integerOption(
  value: string | undefined,
  name: string,
  lo: number,
  hi: number,
  fallback?: number,
): number {
  if (value === undefined) {
    if (fallback === undefined) throw new UsageError(`${name} is required`);
    return fallback;
  }
  if (!/^\d+$/.test(value) || Number(value) < lo || Number(value) > hi)
    throw new UsageError(`${name} must be an integer ${lo}..${hi}, got "${value}"`);
  return Number(value);
}

export async function readTextFile(path: string): Promise<string> {
  try {
    return await readFile(path, "utf8");
  } catch (err) {
    throw new CommandError(`cannot read ${path}: ${(err as NodeJS.ErrnoException).code ?? String(err)}`);
  }
}

/** The text of a model file after the checks every command makes on its name (present, known extension). */
export async function readModelSource(path: string | undefined, what = "model file"): Promise<string> {
  if (!path) throw new UsageError(`the ${what} is missing`);
  if (!modelFormatOf(path))
    throw new UsageError(`cannot tell the format of "${path}" from its extension (.sbml, .xml, .rules, .txt, .csv)`);
  return readTextFile(path);
}

/** The whole read model (definition, network, warnings); its first error as file:line:column: reason. */
export async function readModel(path: string | undefined, what = "model file"): Promise<ReadModelResult> {
  const text = await readModelSource(path, what);
  try {
    return readModelText(path!, text);
  } catch (err) {
    if (err instanceof ParseError) throw new CommandError(`${path}:${err.line}:${err.column}: ${err.reason}`);
    if (err instanceof EngineError) throw new CommandError(`${path}: ${err.message}`);
    throw err;
  }
}

export async function readModelFile(path: string | undefined, what = "model file"): Promise<BooleanNetwork> {
  return (await readModel(path, what)).network;
}

/** Runs a command body and maps its errors to the exit codes: 2 for usage, 1 for failures the user can fix. */
export async function runCommand(name: string, usage: string, body: () => Promise<number>): Promise<number> {
  try {
    return await body();
  } catch (err) {
    if (err instanceof UsageError) {
      process.stderr.write(`${name}: ${err.message}\n${usage}\n`);
      return 2;
    }
    if (err instanceof CommandError || err instanceof EngineError) {
      process.stderr.write(`${name}: ${err.message}\n`);
      return 1;
    }
    throw err;
  }
}

export function printJson(value: unknown): void {
  process.stdout.write(JSON.stringify(value) + "\n");
}
