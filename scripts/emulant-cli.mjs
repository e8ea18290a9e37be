// Runs the CLI from one esbuild bundle instead of compiling TypeScript at each start; the bundle is rebuilt only
// when a source under server/ or shared/ (or the tsconfig) changed. Each bundle lives in a folder named after the
// newest source time and is built in a private folder, then renamed into place, so CLI processes started at the
// same moment (tests, benchmarks, workers) never see a half-written bundle or one another's deletions.
import { build } from "esbuild";
import { existsSync, mkdirSync, readdirSync, renameSync, rmSync, statSync } from "node:fs";
import { join } from "node:path";
import { pathToFileURL } from "node:url";

const root = new URL("..", import.meta.url).pathname;
const bundles = join(root, "dist", "cli");
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

const sources = Math.max(
  newestMtime(join(root, "server")),
  newestMtime(join(root, "shared")),
  statSync(join(root, "tsconfig.json")).mtimeMs,
);
const outdir = join(bundles, String(Math.floor(sources)));
const out = join(outdir, "main.js");
// A bundle older than a day belongs to sources long replaced; a process still running from it would be rare, and
// would only lose commands it had not loaded yet.
const STALE_MS = 24 * 3600 * 1000;

if (!existsSync(out)) {
  mkdirSync(bundles, { recursive: true });
  const privateDir = join(bundles, `.build-${process.pid}-${Date.now()}`);
  const commands = readdirSync(commandsDir)
    .filter((f) => f.endsWith(".ts") && !f.endsWith(".test.ts"))
    .map((f) => join(commandsDir, f));
  await build({
    entryPoints: [join(root, "server", "cli", "main.ts"), ...commands],
    outdir: privateDir,
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
  try {
    renameSync(privateDir, outdir);
  } catch {
    // Another process renamed its identical bundle into place first.
    rmSync(privateDir, { recursive: true, force: true });
  }
  for (const entry of readdirSync(bundles)) {
    const path = join(bundles, entry);
    if (path !== outdir && Date.now() - statSync(path).mtimeMs > STALE_MS)
      rmSync(path, { recursive: true, force: true });
  }
}
await import(pathToFileURL(out).href);
