// Benchmark of the elementary-rule block-emulation hierarchy (symmetry classes, fixed-point pairing, chunk tables,
// linear algebra for affine rules) against the naive all-pairs reference that simulates every ordered pair of
// codewords cell by cell. Each measurement runs in its own child process so that maxRSS belongs to that run alone.
// Usage: npm run bench:eca                 every row, ending with K = 16 as a sharded run and its self-check
//        npm run bench:eca -- --quick      without the K = 16 run
//        npm run bench:eca -- --run 15     only the sharded run and self-check at K = 15
// (wall-clock figures on a shared 2-core machine: expect noise)
import { spawnSync } from "node:child_process";
import { fileURLToPath, pathToFileURL } from "node:url";
import { Worker, isMainThread, parentPort, workerData } from "node:worker_threads";
import os from "node:os";
import {
  ecaHierarchy,
  naiveEcaMinBlocks,
  runHierarchyShard,
  mergeHierarchyParts,
  assembleEcaHierarchy,
  checkHierarchyAgainstSmaller,
  HIERARCHY_SHARDS,
} from "@shared/engine/block-emulation";
import type { EcaHierarchy, HierarchyPart } from "@shared/engine/block-emulation";

interface Measure {
  seconds: number;
  cpuSeconds: number;
  maxRssMB: number;
  peakHeapMB: number;
  pairs: number;
  relations?: number;
  rules?: number;
}

/** Seconds the naive reference may spend on one block size before it is sampled on fewer source rules. */
const NAIVE_BUDGET_S = 20;
const FULL_K14_LIMIT_S = 600;

function heapMB(): number {
  const m = process.memoryUsage();
  return (m.heapUsed + m.arrayBuffers) / 2 ** 20;
}

/**
 * The hierarchy as the run system computes it: HIERARCHY_SHARDS shards queued for `threads` worker threads, each
 * thread taking the next shard when it finishes one, then merged and assembled on the main thread.
 */
async function shardedHierarchy(
  maxBlock: number,
  threads: number,
  self: string,
): Promise<{ hierarchy: EcaHierarchy; shardSeconds: number[]; assembleSeconds: number }> {
  const shardCount = HIERARCHY_SHARDS;
  const parts: HierarchyPart[] = [];
  const shardSeconds: number[] = [];
  let next = 0;
  // an eval'd bootstrap registers the tsx loader in the thread, then imports this file
  const bootstrap = `import("tsx/esm/api").then((api) => { api.register(); return import(${JSON.stringify(pathToFileURL(self).href)}); })`;
  await Promise.all(
    Array.from(
      { length: threads },
      () =>
        new Promise<void>((resolve, reject) => {
          const w = new Worker(bootstrap, { eval: true, workerData: { maxBlock, shardCount } });
          const give = () => {
            if (next >= shardCount) {
              void w.terminate().then(() => resolve());
              return;
            }
            w.postMessage(next++);
          };
          w.on("message", (m: { shardIndex: number; part: HierarchyPart; seconds: number } | "ready") => {
            if (m !== "ready") {
              parts.push(m.part);
              shardSeconds[m.shardIndex] = m.seconds;
            }
            give();
          });
          w.once("error", reject);
        }),
    ),
  );
  const t0 = performance.now();
  const hierarchy = assembleEcaHierarchy(mergeHierarchyParts(parts));
  return { hierarchy, shardSeconds, assembleSeconds: (performance.now() - t0) / 1000 };
}

async function measureChild(kind: string, a: number, b: number): Promise<void> {
  let peak = heapMB();
  const sample = () => {
    peak = Math.max(peak, heapMB());
  };
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  let pairs: number;
  let relations: number | undefined;
  let rules: number | undefined;
  if (kind === "fast") {
    const h = ecaHierarchy(a, { onProgress: sample });
    pairs = h.pairsExamined;
    relations = h.relations.length;
  } else if (kind === "threads") {
    const { hierarchy } = await shardedHierarchy(a, b, fileURLToPath(import.meta.url));
    pairs = hierarchy.pairsExamined;
    relations = hierarchy.relations.length;
  } else {
    // naive: block size a on `b` source rules spread evenly over 0..255
    const sources = Array.from({ length: b }, (_, i) => Math.floor((i * 256) / b));
    const r = naiveEcaMinBlocks(a, { blocks: [a], sources, onProgress: sample });
    pairs = r.pairsExamined;
    rules = b;
  }
  sample();
  const seconds = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  console.log(
    JSON.stringify({
      seconds,
      cpuSeconds,
      maxRssMB: process.resourceUsage().maxRSS / 1024,
      peakHeapMB: peak,
      pairs,
      relations,
      rules,
    }),
  );
}

function spawn(self: string, kind: string, a: number, b: number, timeoutS?: number): Measure | null {
  const r = spawnSync(process.execPath, ["--import", "tsx", self, "--one", kind, String(a), String(b)], {
    encoding: "utf8",
    maxBuffer: 1 << 20,
    timeout: timeoutS ? timeoutS * 1000 : undefined,
  });
  if (r.error || r.status !== 0) {
    if (timeoutS && (r.signal === "SIGTERM" || (r.error as NodeJS.ErrnoException | undefined)?.code === "ETIMEDOUT"))
      return null;
    throw new Error(`${kind} run failed: ${r.stderr || r.error}`);
  }
  return JSON.parse(r.stdout.trim().split("\n").at(-1)!) as Measure;
}

const naivePairs = (k: number) => 256 * 2 ** k * (2 ** k - 1);

async function main(): Promise<void> {
  if (!isMainThread) {
    const { maxBlock, shardCount } = workerData as { maxBlock: number; shardCount: number };
    parentPort!.on("message", (shardIndex: number) => {
      const t0 = performance.now();
      const { part } = runHierarchyShard({ maxBlock, shardIndex, shardCount });
      parentPort!.postMessage({ shardIndex, part, seconds: (performance.now() - t0) / 1000 });
    });
    parentPort!.postMessage("ready");
    return;
  }
  const args = process.argv.slice(2);
  if (args[0] === "--one") {
    await measureChild(args[1]!, Number(args[2]), Number(args[3]));
    return;
  }
  const self = fileURLToPath(import.meta.url);
  const runAt = args.indexOf("--run");
  if (runAt >= 0) {
    await bigRun(Number(args[runAt + 1] ?? 16), self);
    return;
  }
  const blocks = [8, 10, 11, 12];
  const maxK = Math.max(...blocks);
  console.log(
    "Block-emulation hierarchy of the 256 elementary rules, block sizes 1..K, time t = k. Shared 2-core machine: timings are noisy.",
  );
  console.log("Targets: K=11 under 5 s, K=14 under 10 min (fast engine, one thread).");
  console.log(
    "CPU s is the run's own processor time (user + system): less sensitive than wall time to other work on the machine.",
  );
  console.log(
    "Memory: peak resident set of the run's own process (maxRSS, includes ~60 MB of Node/tsx runtime) and peak V8 heap + buffers.",
  );
  console.log(
    `Naive reference: every ordered pair of distinct k-cell words, simulated cell by cell, for all 256 rules and every k <= K.`,
  );
  console.log(
    `  Capped: a block size whose full run would exceed ${NAIVE_BUDGET_S} s is run on an even sample of source rules and scaled to 256;`,
  );
  console.log(
    `  when even one rule would exceed it, its time is extrapolated from the last measured seconds per pair times (k/k')^2 (work per pair ~ k^2).`,
  );
  console.log("");
  // naive, one block size at a time
  const naive: { k: number; seconds: number; how: string; maxRssMB: number; peakHeapMB: number }[] = [];
  // the naive cost model uses wall time like the fast figures it is compared with
  let perPair = 0;
  let perPairK = 1;
  for (let k = 1; k <= maxK; k++) {
    const predictedPerRule = perPair > 0 ? (perPair * (k / perPairK) ** 2 * naivePairs(k)) / 256 : 0;
    if (predictedPerRule * 256 <= NAIVE_BUDGET_S) {
      const m = spawn(self, "naive", k, 256)!;
      naive.push({ k, seconds: m.seconds, how: "measured", maxRssMB: m.maxRssMB, peakHeapMB: m.peakHeapMB });
      perPair = m.seconds / m.pairs;
      perPairK = k;
    } else if (predictedPerRule * 2 <= NAIVE_BUDGET_S) {
      const rules = Math.max(2, Math.min(128, 2 ** Math.floor(Math.log2(NAIVE_BUDGET_S / predictedPerRule))));
      const m = spawn(self, "naive", k, rules)!;
      naive.push({
        k,
        seconds: (m.seconds * 256) / rules,
        how: `sampled ${rules}/256 rules`,
        maxRssMB: m.maxRssMB,
        peakHeapMB: m.peakHeapMB,
      });
      perPair = m.seconds / m.pairs;
      perPairK = k;
    } else {
      naive.push({ k, seconds: predictedPerRule * 256, how: "extrapolated", maxRssMB: NaN, peakHeapMB: NaN });
    }
  }
  console.log("naive per block size: " + naive.map((n) => `k=${n.k} ${n.seconds.toFixed(1)} s (${n.how})`).join("; "));
  console.log("");
  console.log(
    "K  | fast s  (CPU s)  maxRSS MB  heap MB  pairs examined | naive s (how)                          maxRSS MB  heap MB  pairs examined | naive/fast time  pairs ratio",
  );
  for (const K of blocks) {
    const fast = spawn(self, "fast", K, 0)!;
    const parts = naive.filter((n) => n.k <= K);
    const nSeconds = parts.reduce((s, n) => s + n.seconds, 0);
    const measuredOnly = parts.every((n) => n.how === "measured");
    const how = measuredOnly
      ? "measured"
      : parts.some((n) => n.how === "extrapolated")
        ? "partly extrapolated"
        : "partly sampled";
    const nPairs = parts.reduce((s, n) => s + naivePairs(n.k), 0);
    const nRss = Math.max(...parts.map((n) => n.maxRssMB).filter((x) => !Number.isNaN(x)));
    const nHeap = Math.max(...parts.map((n) => n.peakHeapMB).filter((x) => !Number.isNaN(x)));
    console.log(
      `${String(K).padEnd(2)} | ${fast.seconds.toFixed(2).padStart(6)} (${fast.cpuSeconds.toFixed(2).padStart(6)})  ${fast.maxRssMB.toFixed(0).padStart(9)}  ${fast.peakHeapMB.toFixed(0).padStart(7)}  ${String(fast.pairs).padStart(14)} | ` +
        `${nSeconds.toFixed(1).padStart(8)} (${how})`.padEnd(40) +
        ` ${nRss.toFixed(0).padStart(9)}  ${nHeap.toFixed(0).padStart(7)}  ${String(nPairs).padStart(14)} | ${(nSeconds / fast.seconds).toFixed(0).padStart(15)}  ${(nPairs / fast.pairs).toFixed(0).padStart(11)}`,
    );
  }
  console.log("");
  console.log(
    `Same hierarchy as the run system splits it, ${HIERARCHY_SHARDS} shards on 2 worker threads (CPU s counts both threads):`,
  );
  for (const K of [11, 12]) {
    const m = spawn(self, "threads", K, 2)!;
    console.log(
      `K=${K}: ${m.seconds.toFixed(2)} s wall (${m.cpuSeconds.toFixed(2)} s CPU), maxRSS ${m.maxRssMB.toFixed(0)} MB, ${m.pairs} pairs examined, ${m.relations} relations`,
    );
  }
  console.log("");
  const k14 = spawn(self, "fast", 14, 0, FULL_K14_LIMIT_S);
  if (k14) {
    console.log(
      `K=14 fast hierarchy: ${k14.seconds.toFixed(1)} s wall (${k14.cpuSeconds.toFixed(1)} s CPU), maxRSS ${k14.maxRssMB.toFixed(0)} MB, heap ${k14.peakHeapMB.toFixed(0)} MB, ${k14.pairs} pairs examined, ${k14.relations} relations`,
    );
  } else {
    console.log(`K=14 fast hierarchy: did not finish within ${FULL_K14_LIMIT_S} s`);
  }
  if (!args.includes("--quick")) {
    console.log("");
    await bigRun(16, self);
  }
}

/**
 * K = 15 or 16 as a sharded run on the machine's threads, then checked against itself: the relations up to K - 2
 * must be exactly the K - 2 hierarchy's, every pair first found above K - 2 must replay in the independent
 * simulator, and relations and mutual classes must be closed under reflection and complement.
 */
async function bigRun(maxBlock: number, self: string): Promise<void> {
  const threads = os.availableParallelism();
  console.log(
    `K=${maxBlock} as a sharded run (${HIERARCHY_SHARDS} shards, ${threads} worker threads; target: under 30 min on 2 cores). Load before: ${os
      .loadavg()
      .map((x) => x.toFixed(2))
      .join(" ")}`,
  );
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  const run = await shardedHierarchy(maxBlock, threads, self);
  const seconds = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  const h = run.hierarchy;
  console.log(
    `K=${maxBlock}: ${seconds.toFixed(0)} s wall (${((cpu.user + cpu.system) / 1e6).toFixed(0)} s CPU, both threads), maxRSS ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB; assembly ${run.assembleSeconds.toFixed(1)} s`,
  );
  console.log(`  shards (s): ${run.shardSeconds.map((x) => x.toFixed(1)).join(" ")}`);
  console.log(
    `  ${h.relations.length} relations, ${h.composed.length} composed pairs, ${h.mutualClasses.length} mutual classes, ${h.reduction.length} reduction edges, ${h.emulateNothing.length} rules emulating nothing, ${h.pairsExamined} pairs examined`,
  );
  const smaller = maxBlock - 2;
  const t1 = performance.now();
  const small = (await shardedHierarchy(smaller, threads, self)).hierarchy;
  const check = checkHierarchyAgainstSmaller(h, small);
  console.log(
    `  self-check against K=${smaller} (computed in ${((performance.now() - t1) / 1000).toFixed(0)} s): ${check.ok ? "PASS" : "FAIL"}`,
  );
  console.log(
    `    K=${smaller} relations kept with the same least block: ${small.relations.length - check.lost.length}/${small.relations.length}; relations at k <= ${smaller} not in K=${smaller}: ${check.unexpected.length}`,
  );
  console.log(
    `    pairs first found at k = ${smaller + 1}..${maxBlock}: ${check.newPairs}, witnesses rejected by the independent simulator: ${check.newPairsRejected.length}`,
  );
  console.log(
    `    relations whose reflection or complement image is missing: ${check.symmetryBreaks.length}; mutual classes not mapped onto classes: ${check.classBreaks.length}; composed witnesses rejected: ${check.composedRejected}`,
  );
  if (check.newPairs > 0)
    console.log(
      `    new pairs: ${h.relations
        .filter((r) => r.minBlock > smaller)
        .slice(0, 40)
        .map((r) => `${r.source}->${r.target}@${r.minBlock}`)
        .join(" ")}${check.newPairs > 40 ? " ..." : ""}`,
    );
  if (!check.ok) process.exitCode = 1;
}

void main();
