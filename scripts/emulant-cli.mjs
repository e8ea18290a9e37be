// Runs the CLI from one esbuild bundle instead of compiling TypeScript at each start; the bundle is rebuilt only
// when a source under server/ or shared/ (or the tsconfig) is newer than it.
import { build } from "esbuild";
import { readdirSync, rmSync, statSync } from "node:fs";
import { join } from "node:path";
import { pathToFileURL } from "node:url";

const root = new URL("..", import.meta.url).pathname;
const outdir = join(root, "dist", "cli");
const out = join(outdir, "main.js");
const commandsDir = join(root, "server", "cli", "commands");

function newestMtime(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestMtime(path));
    else if (entry.name.endsWith(".ts")) newest = Math.max(newest, statSync(path).mtimeMs);
  }
  return newest;
}

function bundleMtime() {
  try {
    return statSync(out).mtimeMs;
  } catch {
    return -1;
  }
}

const sources = Math.max(
  newestMtime(join(root, "server")),
  newestMtime(join(root, "shared")),
  statSync(join(root, "tsconfig.json")).mtimeMs,
);
if (bundleMtime() < sources) {
  rmSync(outdir, { recursive: true, force: true });
  const commands = readdirSync(commandsDir)
    .filter((f) => f.endsWith(".ts") && !f.endsWith(".test.ts"))
    .map((f) => join(commandsDir, f));
  await build({
    entryPoints: [join(root, "server", "cli", "main.ts"), ...commands],
    outdir,
    outbase: join(root, "server", "cli"),
    splitting: true,
    chunkNames: "chunks/[name]-[hash]",
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    packages: "external",
    tsconfig: join(root, "tsconfig.json"),
    logLevel: "error",
  });
}
await import(pathToFileURL(out).href);
