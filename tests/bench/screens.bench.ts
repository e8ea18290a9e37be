// Benchmark of perturbation screens on seeded random NK networks (Kauffman, J. Theor. Biol. 1969; K = 2): every
// single perturbation of a 20-node model, every single and pair of a 16-node model, beside a naive screen that
// analyses each perturbed network from scratch; then a screen above the exact limit by SAT fixed points.
// Usage: npm run bench:screens   (wall-clock on a shared 2-core machine: expect noise; no time is asserted)
import seedrandom from "seedrandom";
import { nkNetwork } from "@shared/engine/generators";
import type { BooleanNetwork } from "@shared/engine/network";
import { perturbNetwork } from "@shared/engine/perturbation";
import { runScreen, screenUnits, type ScreenSpec } from "@shared/engine/screens";
import { analyseSynchronous } from "@shared/engine/state-graph";

function network(n: number, seed: number): BooleanNetwork {
  return nkNetwork({ n, k: 2, random: seedrandom(String(seed)) });
}

function seconds(run: () => void): number {
  const t0 = performance.now();
  run();
  return (performance.now() - t0) / 1000;
}

/** The obvious screen: perturbNetwork and a full analyseSynchronous for every unit. */
function naiveScreen(net: BooleanNetwork, spec: ScreenSpec): void {
  const index = (name: string) => net.names.indexOf(name);
  analyseSynchronous(net);
  for (const unit of screenUnits(spec)) {
    const entries = Object.entries(unit.perturbation);
    analyseSynchronous(
      perturbNetwork(net, {
        knockOut: entries.filter(([, v]) => v === 0).map(([x]) => index(x)),
        overExpress: entries.filter(([, v]) => v === 1).map(([x]) => index(x)),
      }),
    );
  }
}

const cases: { label: string; n: number; pairs: boolean; targetSeconds: number | null; naive: boolean }[] = [
  { label: "20 nodes, singles (40 perturbations)", n: 20, pairs: false, targetSeconds: 30, naive: true },
  { label: "16 nodes, singles and pairs (512)", n: 16, pairs: true, targetSeconds: 60, naive: true },
  { label: "24 nodes, singles (48 perturbations)", n: 24, pairs: false, targetSeconds: null, naive: false },
];

// Warm the JIT on a small screen so the first measured case is not charged for compilation.
const warm = network(14, 1514);
runScreen(warm, { nodes: warm.names, pairs: true, phenotype: { x0: 1 } });
naiveScreen(warm, { nodes: warm.names.slice(0, 4), pairs: false, phenotype: { x0: 1 } });

console.log("Perturbation screens (exact synchronous basins), seeded NK networks with K = 2");
console.log("case                                   units   screen s   naive s   target");
for (const c of cases) {
  const net = network(c.n, 1500 + c.n);
  const spec: ScreenSpec = { nodes: net.names, pairs: c.pairs, phenotype: { x0: 1, x1: 0 } };
  let units = 0;
  const screen = seconds(() => (units = runScreen(net, spec).rows.length));
  const naive = c.naive ? seconds(() => naiveScreen(net, spec)).toFixed(2) : "-";
  const target =
    c.targetSeconds === null
      ? "(information)"
      : `under ${c.targetSeconds} s ${screen < c.targetSeconds ? "(met)" : "(MISSED)"}`;
  console.log(
    `${c.label.padEnd(38)} ${String(units).padStart(5)} ${screen.toFixed(2).padStart(10)} ${naive.padStart(9)}   ${target}`,
  );
}

const large = network(40, 1540);
const largeSpec: ScreenSpec = { nodes: large.names.slice(0, 10), pairs: false, phenotype: { x0: 1, x1: 0 } };
let largeRows = 0;
const largeSeconds = seconds(() => (largeRows = runScreen(large, largeSpec).rows.length));
console.log(
  `\nAbove the exact limit: 40 nodes, 10 nodes screened (${largeRows} perturbations) by SAT fixed points: ${largeSeconds.toFixed(2)} s (information)`,
);
