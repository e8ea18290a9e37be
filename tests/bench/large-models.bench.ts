// Benchmark of the large-model engine (`npm run bench:large`): minimal trap spaces, fixed points by SAT and node
// elimination on seeded Kauffman NK networks of 100, 300 and 1,000 nodes with in-degree 2 and 3, and on seeded
// threshold networks (three weighted regulators plus the node itself through the "keep" tie rule), and the independent
// verifier on the certificate of each elimination. Targets: minimal trap spaces of a 1,000-node in-degree-2 network
// under 60 s; fixed points of a 300-node network under 10 s; verifying the elimination certificate of a 1,000-node
// network under 20 s, the interactive pool's limit (saving a reduced model verifies there). Each
// measurement runs in a child process with a time budget, since one SAT call cannot be interrupted from inside;
// "stopped" means the budget ran out. The machine has 2 cores shared with other work, so figures are noisy.
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import seedrandom from "seedrandom";
import { eliminationCertificate, verifyCertificate } from "@shared/engine/certificates";
import { eliminateNodes } from "@shared/engine/elimination";
import { nkNetwork, thresholdNetwork } from "@shared/engine/generators";
import type { BooleanNetwork } from "@shared/engine/network";
import { compileDefinition } from "@shared/engine/rules";
import { satFixedPoints } from "@shared/engine/sat";
import { trapSpaces } from "@shared/engine/trap-spaces";

const BUDGET_S = Number(process.env.BENCH_BUDGET_S ?? 120);
const LIMIT = 1_000;

function network(name: string): BooleanNetwork {
  const [family, size, degree] = name.split("-");
  const n = Number(size);
  const k = Number(degree);
  const random = seedrandom(`bench-large-${name}`);
  return family === "nk" ? nkNetwork({ n, k, random }) : compileDefinition(thresholdNetwork({ n, k, random }));
}

type Task = "trap-spaces" | "fixed-points" | "elimination" | "elimination-check";

function measure(name: string, task: Task): { seconds: number; detail: string } {
  const net = network(name);
  if (task === "elimination-check") {
    const r = eliminateNodes(net, "all-eligible");
    // Through JSON, as the verifier meets a stored certificate.
    const certificate: unknown = JSON.parse(JSON.stringify(eliminationCertificate(net, r.network, r.eliminated)));
    const t0 = performance.now();
    const report = verifyCertificate(certificate);
    return {
      seconds: (performance.now() - t0) / 1000,
      detail: `${report.valid ? "valid" : `INVALID: ${report.problems[0]}`}, ${r.eliminated.length} eliminations re-derived, ${report.statesChecked} rows compared`,
    };
  }
  const t0 = performance.now();
  let detail: string;
  if (task === "trap-spaces") {
    const r = trapSpaces(net, { limit: LIMIT });
    const free = r.trapSpaces.map((t) => [...t.pattern].filter((c) => c === "-").length);
    detail = `${r.complete ? "" : ">= "}${r.trapSpaces.length} minimal (${free.filter((f) => f === 0).length} fixed points, largest free part ${Math.max(0, ...free)}), ${r.percolatedNodes} percolated`;
  } else if (task === "fixed-points") {
    const r = satFixedPoints(net, { maxSolutions: LIMIT });
    detail = `${r.complete ? "" : ">= "}${r.states.length} fixed points`;
  } else {
    const r = eliminateNodes(net, "all-eligible");
    const maxIn = Math.max(0, ...r.network.regulators.map((x) => x.length));
    detail = `${net.names.length} -> ${r.network.names.length} nodes, largest in-degree ${maxIn}, ${r.skipped.length} skipped at the regulator limit`;
  }
  return { seconds: (performance.now() - t0) / 1000, detail };
}

const caseIndex = process.argv.indexOf("--case");
if (caseIndex >= 0) {
  const [name, task] = process.argv.slice(caseIndex + 1, caseIndex + 3) as [string, Task];
  process.stdout.write(JSON.stringify(measure(name, task)) + "\n");
} else {
  const targets: Record<string, number> = {
    "trap-spaces nk-1000-2": 60,
    "fixed-points nk-300-2": 10,
    "fixed-points nk-300-3": 10,
    "elimination-check nk-1000-2": 20,
  };
  const names = [
    "nk-100-2",
    "nk-300-2",
    "nk-1000-2",
    "nk-100-3",
    "nk-300-3",
    "nk-1000-3",
    "threshold-100-3",
    "threshold-300-3",
    "threshold-1000-3",
  ];
  const rows: string[][] = [["case", "network", "seconds", "target", "result"]];
  const script = fileURLToPath(import.meta.url);
  for (const task of ["trap-spaces", "fixed-points", "elimination", "elimination-check"] as const) {
    for (const name of names) {
      const child = spawnSync(process.execPath, ["--import", "tsx", script, "--case", name, task], {
        encoding: "utf8",
        timeout: BUDGET_S * 1000,
      });
      const target = targets[`${task} ${name}`];
      let seconds = "stopped";
      let detail = `no answer within the ${BUDGET_S} s budget`;
      if (child.status === 0) {
        const r = JSON.parse(child.stdout.trim().split("\n").pop()!) as { seconds: number; detail: string };
        seconds = r.seconds.toFixed(2);
        detail = r.detail;
      } else if (child.error === undefined && child.signal === null)
        detail = `failed: ${child.stderr.trim().split("\n").pop()}`;
      const verdict =
        target === undefined
          ? "-"
          : seconds !== "stopped" && Number(seconds) < target
            ? `< ${target} s ok`
            : `< ${target} s MISSED`;
      rows.push([task, name, seconds, verdict, detail]);
      process.stdout.write(`${rows.at(-1)!.join("  ")}\n`);
    }
  }
  const widths = rows[0]!.map((_, c) => Math.max(...rows.map((r) => r[c]!.length)));
  process.stdout.write(
    "\n" + rows.map((r) => r.map((cell, c) => cell.padEnd(widths[c]!)).join("  ")).join("\n") + "\n",
  );
}
