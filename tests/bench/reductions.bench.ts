// Benchmark of the reductions engine (`npm run bench:reductions`): given-target block-emulation searches on planted
// sources of 16, 24, 32 and 64 nodes (m = 3, t <= 3, blocks of at most 3 nodes; SAT method, plus the enumeration
// method on 12 nodes for comparison), dynamical embedding and
// coarse-graining at 16 and 20 nodes, verify of 24-node targets (target 5 s), and discover runs for information. Targets: each search under 60 s; embedding and coarse-graining at 20 nodes
// under 10 s. The machine has 2 cores shared with other work, so figures are noisy.
import seedrandom from "seedrandom";
import {
  networkFromSuccessors,
  plantEmulation,
  powerTable,
  randomNetwork,
  searchBlockEmulation,
  successorsOfNetwork,
  trivialityFlags,
  interactionCount,
  discoverEmulatedTargets,
  canonicalTargetKey,
} from "@shared/engine/emulation";
import { findDynamicalEmbedding } from "@shared/engine/embedding";
import { coarseGrain, nodeObservable } from "@shared/engine/coarse-graining";
import { checkNetwork } from "@shared/engine/network";
import { blockEmulationCertificate, embeddingCertificate, verifyCertificate } from "@shared/engine/certificates";
import { measureCli, writeModelFile } from "./cli-measure";

const rows: string[][] = [];
const time = <T>(f: () => T): [T, number] => {
  const t0 = performance.now();
  const out = f();
  return [out, (performance.now() - t0) / 1000];
};
const verdict = (seconds: number, limit: number) => (seconds < limit ? "ok" : "OVER");

const rng = seedrandom("reductions-bench");
/** A 3-node target with interactions between its nodes (random ones are often constant or decoupled). */
function interactingTarget(prefix: string, random = rng) {
  for (;;) {
    const G = randomNetwork(random, 3, 3, prefix);
    const succ = successorsOfNetwork(G);
    if (trivialityFlags(succ, 3).length === 0 && interactionCount(succ, 3) >= 3) return G;
  }
}
// Issue 16's discovery rows, as one CLI process each (start-up included), printed at once because the rest is long.
{
  // Its own generator, so that the rows below keep drawing the same networks as before.
  const own = seedrandom("issue-16");
  const { source } = plantEmulation(own, interactingTarget("g", own), 12, 3);
  const file = writeModelFile(source, "planted-n12");
  console.log("Issue 16 rows (emulant discover on a 12-node planted model, start-up included):");
  for (const [t, limit] of [
    [4, 5],
    [1, 2],
  ] as const) {
    const r = measureCli([
      "discover",
      file,
      "--max-target-nodes",
      "4",
      "--time",
      String(t),
      "--max-block",
      "3",
      "--json",
    ]);
    console.log(
      `  discover n=12 m<=4 t=${t} blocks<=3: ${r.seconds.toFixed(2)} s, ${r.maxRssMB.toFixed(0)} MB peak | target <= ${limit} s`,
    );
  }
}

for (const n of [16, 24, 32, 64]) {
  for (const t of [1, 2, 3]) {
    const G = interactingTarget("g");
    const { source } = plantEmulation(rng, G, n, 3);
    // F emulates G at time 1, hence G^t at time t: the search must rule out the smaller time scales first.
    const H = networkFromSuccessors(["h0", "h1", "h2"], powerTable(successorsOfNetwork(G), t));
    const [r, s] = time(() => searchBlockEmulation(source, H, { maxTime: 3, maxBlock: 3 }));
    const valid = r.found ? verifyCertificate(blockEmulationCertificate(source, H, r.witness!)).valid : "-";
    rows.push([
      `emulate n=${n} target=G^${t}`,
      s.toFixed(2),
      verdict(s, 60),
      `found=${r.found} at t=${r.witness?.time ?? "-"} verified=${valid} sat=${r.satQueries}`,
    ]);
  }
  if (n === 16) {
    // For comparison: the exhaustive enumeration of encodings, which grows with 2^n and fits sources of about 12 nodes.
    for (const t of [1, 3]) {
      const G = interactingTarget("g");
      const { source } = plantEmulation(rng, G, 12, 3);
      const H = networkFromSuccessors(["h0", "h1", "h2"], powerTable(successorsOfNetwork(G), t));
      const [r, s] = time(() => searchBlockEmulation(source, H, { maxTime: 3, maxBlock: 3, method: "enumeration" }));
      const valid = r.found ? verifyCertificate(blockEmulationCertificate(source, H, r.witness!)).valid : "-";
      rows.push([
        `emulate n=12 target=G^${t} by enumeration`,
        s.toFixed(2),
        "",
        `found=${r.found} at t=${r.witness?.time ?? "-"} verified=${valid}`,
      ]);
    }
  }
  const unrelated = interactingTarget("u");
  const noise = randomNetwork(rng, n, 2);
  const [r, s] = time(() => searchBlockEmulation(noise, unrelated, { maxTime: 3, maxBlock: 3 }));
  rows.push([
    `emulate n=${n} random source`,
    s.toFixed(2),
    verdict(s, 60),
    `found=${r.found} at t=${r.witness?.time ?? "-"} sat=${r.satQueries}`,
  ]);
}

// Discover (no target given): enumeration up to 16 nodes, SAT above; the planted target must be among the findings.
for (const n of [12, 24, 64]) {
  const G = interactingTarget("g");
  const { source } = plantEmulation(rng, G, n, 2);
  const [d, s] = time(() => discoverEmulatedTargets(source, { maxTargetNodes: 3, maxTime: 1, maxBlock: 2 }));
  const planted = d.targets.some((x) => x.key === canonicalTargetKey(successorsOfNetwork(G), 3));
  rows.push([
    `discover n=${n} m<=3 t=1 blocks<=2`,
    s.toFixed(2),
    "",
    `targets=${d.targets.length} non-trivial=${d.targets.filter((x) => !x.trivial).length} planted found=${planted}`,
  ]);
}

for (const n of [16, 20]) {
  const G = randomNetwork(rng, 4, 2, "g");
  const { source } = plantEmulation(rng, G, n, 3);
  const G2 = networkFromSuccessors(G.names, powerTable(successorsOfNetwork(G), 2));
  const [r, s] = time(() => findDynamicalEmbedding(source, G2, 2));
  const valid = r.found ? verifyCertificate(embeddingCertificate(source, G2, 2, r.map!)).valid : "-";
  rows.push([
    `embed n=${n} planted m=4 target=G^2 t=2`,
    s.toFixed(2),
    n === 20 ? verdict(s, 10) : "",
    `found=${r.found} verified=${valid}`,
  ]);
  const random = randomNetwork(rng, n, 3);
  const [r2, s2] = time(() => findDynamicalEmbedding(random, G, 1));
  rows.push([
    `embed n=${n} random source m=4 t=1`,
    s2.toFixed(2),
    n === 20 ? verdict(s2, 10) : "",
    `found=${r2.found}`,
  ]);
  const F = randomNetwork(rng, n, 3);
  const [c, s3] = time(() =>
    coarseGrain(
      F,
      [0, 1, 2].map((v) => nodeObservable(F, v)),
      1,
    ),
  );
  rows.push([
    `coarse-grain n=${n} 3 observables`,
    s3.toFixed(2),
    n === 20 ? verdict(s3, 10) : "",
    `closes=${c.closes} groups=${c.groups}`,
  ]);
}

// verify of certificates whose target has 24 nodes (2^24 target states): a random in-degree-2 network emulating
// itself with one-node blocks, and a 48-node dual-rail source (block {a, b}, codewords 01 and 10, b' = !a') at t = 1.
{
  const G = randomNetwork(rng, 24, 2, "g");
  const identity = blockEmulationCertificate(G, G, {
    time: 1,
    blocks: G.names.map((_, v) => ({ nodes: [v], zero: [0], one: [1] })),
    context: G.names.map(() => -1),
  });
  const dual = checkNetwork({
    names: G.names.flatMap((name) => [`${name}a`, `${name}b`]),
    regulators: G.names.flatMap((_, v) => {
      const regs = Int32Array.from(G.regulators[v]!, (r) => 2 * r);
      return [regs, regs];
    }),
    tables: G.names.flatMap((_, v) => [G.tables[v]!, G.tables[v]!.map((b) => 1 - b)]),
  });
  const dualRail = blockEmulationCertificate(dual, G, {
    time: 1,
    blocks: G.names.map((_, v) => ({ nodes: [2 * v, 2 * v + 1], zero: [0, 1], one: [1, 0] })),
    context: dual.names.map(() => -1),
  });
  for (const [label, cert] of [
    ["verify m=24 identity t=1", identity],
    ["verify m=24 dual-rail source n=48 t=1", dualRail],
  ] as const) {
    const [report, seconds] = time(() => verifyCertificate(JSON.parse(JSON.stringify(cert))));
    rows.push([label, seconds.toFixed(2), verdict(seconds, 5), `valid=${report.valid} states=${report.statesChecked}`]);
  }
}

const width = [0, 1, 2, 3].map((i) => Math.max(...rows.map((r) => r[i]!.length), 8));
console.log(["case", "seconds", "target", "result"].map((h, i) => h.padEnd(width[i]!)).join("  "));
for (const r of rows) console.log(r.map((c, i) => c.padEnd(width[i]!)).join("  "));
console.log("(2 shared cores: timings are noisy)");
