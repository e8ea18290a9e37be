// Benchmark of the exact synchronous analysis (word-parallel successor table + linear-time attractor search)
// against a plain reference that evaluates one state at a time, on seeded random NK networks.
// Each measurement runs in its own child process so that peak memory (maxRSS) belongs to that run alone.
// Usage: npm run bench:dynamics   (figures are wall-clock on a shared 2-core machine: expect noise)
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import seedrandom from "seedrandom";
import { networkFromFunctions, type BooleanNetwork } from "@shared/engine/network";
import { analyseSynchronous } from "@shared/engine/state-graph";
import { measureCli, writeModelFile } from "./cli-measure";

function randomNK(n: number, k: number, seed: number): BooleanNetwork {
  const rng = seedrandom(String(seed));
  const regulators = Array.from({ length: n }, () => {
    const pool = Array.from({ length: n }, (_, j) => j);
    return Array.from({ length: k }, () => pool.splice(Math.floor(rng() * pool.length), 1)[0]!);
  });
  const tables = regulators.map((r) => Array.from({ length: 1 << r.length }, () => (rng() < 0.5 ? 1 : 0)));
  return networkFromFunctions(
    Array.from({ length: n }, (_, i) => `g${i}`),
    regulators,
    (node, x) => tables[node]![x.reduce((row, v, j) => row | (v << j), 0)]!,
  );
}

/** Plain reference: successor computed one state at a time from the truth tables, attractors by path walking. */
function referenceAnalysis(net: BooleanNetwork): { attractors: number; biggestBasin: number; maxTransient: number } {
  const n = net.names.length;
  const N = 2 ** n;
  const step = (s: number) => {
    let next = 0;
    for (let i = 0; i < n; i++) {
      const regs = net.regulators[i]!;
      let row = 0;
      for (let j = 0; j < regs.length; j++) row |= ((s >>> regs[j]!) & 1) << j;
      next |= net.tables[i]![row]! << i;
    }
    return next;
  };
  const label = new Int32Array(N);
  const depth = new Uint32Array(N);
  const basins: number[] = [0];
  let maxTransient = 0;
  for (let s = 0; s < N; s++) {
    if (label[s] !== 0) continue;
    const path: number[] = [];
    let x = s;
    while (label[x] === 0) {
      label[x] = -1;
      path.push(x);
      x = step(x);
    }
    let a = label[x]!;
    let d = 0;
    let onPath = path.length;
    if (a === -1) {
      basins.push(0);
      a = basins.length - 1;
      onPath = path.indexOf(x);
      for (let q = onPath; q < path.length; q++) label[path[q]!] = a;
    } else d = depth[x]!;
    for (let q = onPath - 1; q >= 0; q--) {
      label[path[q]!] = a;
      depth[path[q]!] = ++d;
    }
    basins[a]! += path.length;
    if (d > maxTransient) maxTransient = d;
  }
  return { attractors: basins.length - 1, biggestBasin: Math.max(...basins), maxTransient };
}

function measureOne(kind: string, n: number, k: number, seed: number): void {
  const net = randomNK(n, k, seed);
  const t0 = performance.now();
  let summary: { attractors: number; biggestBasin: number; maxTransient: number };
  if (kind === "fast") {
    const a = analyseSynchronous(net);
    summary = { attractors: a.attractors.length, biggestBasin: a.attractors[0]!.basin, maxTransient: a.maxTransient };
  } else {
    summary = referenceAnalysis(net);
  }
  const seconds = (performance.now() - t0) / 1000;
  const usage = process.resourceUsage();
  const heap = process.memoryUsage();
  console.log(
    JSON.stringify({
      seconds,
      maxRssMB: usage.maxRSS / 1024,
      heapUsedMB: heap.heapUsed / 2 ** 20,
      arrayBuffersMB: heap.arrayBuffers / 2 ** 20,
      ...summary,
    }),
  );
}

function main(): void {
  const args = process.argv.slice(2);
  if (args[0] === "--one") {
    measureOne(args[1]!, Number(args[2]), Number(args[3]), Number(args[4]));
    return;
  }
  const self = fileURLToPath(import.meta.url);
  const cases: [number, number, number][] = [
    [20, 2, 1],
    [20, 3, 2],
    [24, 2, 3],
    [24, 3, 4],
  ];
  console.log(
    "Exact synchronous analysis, seeded random NK networks (p = 0.5). Timings on a shared 2-core machine are noisy.",
  );
  console.log("Targets: N=20 under 1 s, N=24 under 20 s (fast engine).");
  console.log(
    "Memory: peak resident set (maxRSS, includes the Node/tsx runtime of about 60 MB) and, in brackets, V8 heap + typed-array buffers at the end of the run.",
  );
  console.log(
    "N   K  seed | fast s   fast maxRSS MB (heap+buf) | ref s    ref maxRSS MB (heap+buf) | ref/fast time | attractors  max basin  max transient",
  );
  for (const [n, k, seed] of cases) {
    const run = (kind: string) => {
      const r = spawnSync(
        process.execPath,
        ["--import", "tsx", self, "--one", kind, String(n), String(k), String(seed)],
        { encoding: "utf8", maxBuffer: 1 << 20 },
      );
      if (r.status !== 0) throw new Error(`${kind} run failed: ${r.stderr}`);
      return JSON.parse(r.stdout.trim().split("\n").at(-1)!) as {
        seconds: number;
        maxRssMB: number;
        heapUsedMB: number;
        arrayBuffersMB: number;
        attractors: number;
        biggestBasin: number;
        maxTransient: number;
      };
    };
    const fast = run("fast");
    const ref = run("reference");
    if (
      fast.attractors !== ref.attractors ||
      fast.biggestBasin !== ref.biggestBasin ||
      fast.maxTransient !== ref.maxTransient
    ) {
      throw new Error(`fast and reference disagree on N=${n} K=${k} seed=${seed}`);
    }
    console.log(
      `${String(n).padEnd(3)} ${k}  ${String(seed).padEnd(4)} | ${fast.seconds.toFixed(2).padStart(6)}  ${fast.maxRssMB.toFixed(0).padStart(8)} (${(fast.heapUsedMB + fast.arrayBuffersMB).toFixed(0).padStart(4)})      | ` +
        `${ref.seconds.toFixed(2).padStart(6)}  ${ref.maxRssMB.toFixed(0).padStart(8)} (${(ref.heapUsedMB + ref.arrayBuffersMB).toFixed(0).padStart(4)})     | ${(ref.seconds / fast.seconds).toFixed(1).padStart(13)} | ` +
        `${String(fast.attractors).padStart(10)}  ${String(fast.biggestBasin).padStart(9)}  ${String(fast.maxTransient).padStart(13)}`,
    );
  }
  const file = writeModelFile(randomNK(24, 2, 3), "random-n24-k2");
  const cli = measureCli(["attractors", file, "--json"]);
  console.log(
    `Issue 16 row, exact synchronous analysis, random n=24 in-degree 2 (emulant attractors --json, start-up included): ` +
      `${cli.seconds.toFixed(2)} s, ${cli.maxRssMB.toFixed(0)} MB peak | target <= 3 s, <= 200 MB peak`,
  );
}

main();
