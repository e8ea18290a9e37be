// What every command shares: option parsing (node's util.parseArgs, strict), integer checks with ranges, reading a
// model file of any format with errors as file:line:column: reason, and the exit codes (2 usage, 1 failure).
import { readFile } from "node:fs/promises";
import { parseArgs, type ParseArgsConfig } from "node:util";
import { EngineError, ParseError } from "../../shared/engine/errors";
import type { BooleanNetwork } from "../../shared/engine/network";
import { modelFormatOf, readModelText } from "../../shared/formats/read-model";

export class UsageError extends Error {}
export class CommandError extends Error {}

export type Options = NonNullable<ParseArgsConfig["options"]>;

export function parseCommandArgs<O extends Options>(args: string[], options: O) {
  try {
    return parseArgs({ args, options, allowPositionals: true, strict: true });
  } catch (err) {
    throw new UsageError((err as Error).message.replace(/\. To specify a positional.*$/s, ""));
  }
}

export function integerOption(value: string | undefined, name: string, lo: number, hi: number, fallback?: number): number {
  if (value === undefined) {
    if (fallback === undefined) throw new UsageError(`${name} is required`);
    return fallback;
  }
  if (!/^\d+$/.test(value) || Number(value) < lo || Number(value) > hi) throw new UsageError(`${name} must be an integer ${lo}..${hi}, got "${value}"`);
  return Number(value);
}

export async function readTextFile(path: string): Promise<string> {
  try {
    return await readFile(path, "utf8");
  } catch (err) {
    throw new CommandError(`cannot read ${path}: ${(err as NodeJS.ErrnoException).code ?? String(err)}`);
  }
}

export async function readModelFile(path: string | undefined, what = "model file"): Promise<BooleanNetwork> {
  if (!path) throw new UsageError(`the ${what} is missing`);
  if (!modelFormatOf(path)) throw new UsageError(`cannot tell the format of "${path}" from its extension (.sbml, .xml, .rules, .txt, .csv)`);
  const text = await readTextFile(path);
  try {
    return readModelText(path, text).network;
  } catch (err) {
    if (err instanceof ParseError) throw new CommandError(`${path}:${err.line}:${err.column}: ${err.reason}`);
    if (err instanceof EngineError) throw new CommandError(`${path}: ${err.message}`);
    throw err;
  }
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
