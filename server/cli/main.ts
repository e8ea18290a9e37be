// `npm run -s emulant -- <command> [args]`: each command is a module in ./commands exporting
// `run(args): Promise<number>` (the exit code) and a one-line `summary`, so adding a command never touches this file.
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

interface Command {
  run(args: string[]): Promise<number>;
  summary?: string;
}

const commandsDir = path.join(path.dirname(fileURLToPath(import.meta.url)), "commands");
// ".ts" under tsx and vitest, ".js" when run from the esbuild bundle (scripts/emulant-cli.mjs).
const ext = path.extname(fileURLToPath(import.meta.url));

function commandNames(): string[] {
  return fs
    .readdirSync(commandsDir)
    .filter((f) => f.endsWith(ext) && !f.endsWith(`.test${ext}`))
    .map((f) => f.slice(0, -ext.length))
    .sort();
}

async function usage(): Promise<string> {
  const lines = ["usage: npm run -s emulant -- <command> [options]", "", "commands:"];
  for (const name of commandNames()) {
    const mod = (await import(pathToFileURL(path.join(commandsDir, `${name}${ext}`)).href)) as Command;
    lines.push(`  ${name.padEnd(18)} ${mod.summary ?? ""}`);
  }
  return lines.join("\n") + "\n";
}

async function main(): Promise<number> {
  const [name, ...args] = process.argv.slice(2);
  if (!name || name === "help" || name === "--help") {
    process.stdout.write(await usage());
    return name ? 0 : 2;
  }
  if (!/^[a-z][a-z0-9-]*$/.test(name) || !commandNames().includes(name)) {
    process.stderr.write(`emulant: unknown command "${name}"\n\n${await usage()}`);
    return 2;
  }
  const mod = (await import(pathToFileURL(path.join(commandsDir, `${name}${ext}`)).href)) as Command;
  return mod.run(args);
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    process.stderr.write(`emulant: ${err instanceof Error ? err.message : String(err)}\n`);
    process.exitCode = 1;
  },
);
