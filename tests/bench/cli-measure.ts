// Issue 16's workloads are measured as a person meets them: one CLI process, start-up included, with wall time and
// peak resident memory read from GNU time (the child's own maxRSS, not this process's).
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import type { BooleanNetwork } from "@shared/engine/network";
import { networkToDefinition, printRuleText } from "@shared/engine/rules";

const cli = fileURLToPath(new URL("../../scripts/emulant-cli.mjs", import.meta.url));

/** Writes the network as rule text to a fresh temporary file and returns its path. */
export function writeModelFile(net: BooleanNetwork, name: string): string {
  const path = join(mkdtempSync(join(tmpdir(), "emulant-bench-")), `${name}.rules`);
  writeFileSync(path, printRuleText(networkToDefinition(net)));
  return path;
}

/** Runs `node scripts/emulant-cli.mjs <args>` under /usr/bin/time -v; throws when the command fails. */
export function measureCli(args: string[]): { seconds: number; maxRssMB: number; stdout: string } {
  // A first call may rebundle the CLI after a source change; that one-off build is not the workload.
  spawnSync(process.execPath, [cli, "--help"], { encoding: "utf8" });
  const r = spawnSync("/usr/bin/time", ["-v", process.execPath, cli, ...args], {
    encoding: "utf8",
    maxBuffer: 256 << 20,
  });
  if (r.status !== 0) throw new Error(`emulant ${args.join(" ")} failed: ${r.stderr.slice(-2000)}`);
  const field = (label: string) => {
    const m = new RegExp(`${label}: (.+)`).exec(r.stderr);
    if (!m) throw new Error(`GNU time did not report "${label}"`);
    return m[1]!.trim();
  };
  const wall = field("Elapsed \\(wall clock\\) time \\(h:mm:ss or m:ss\\)")
    .split(":")
    .reduce((acc, part) => acc * 60 + Number(part), 0);
  return { seconds: wall, maxRssMB: Number(field("Maximum resident set size \\(kbytes\\)")) / 1024, stdout: r.stdout };
}
