import fc from "fast-check";
import seedrandom from "seedrandom";
import { describe, expect, it } from "vitest";
import { coarseGrainBySat, nodeObservable } from "../coarse-graining";
import { randomNetwork } from "../emulation";
import { checkNetwork, type BooleanNetwork } from "../network";
import { checkCone, planCone } from "./cone-check";
import { coarseGrainingCertificate, networkToCertificate, type CertificateNetwork } from "./certificate-format";
import { verifyCertificate } from "./verify-certificate";

/** Enough padding to take a network of up to 10 nodes above the 22 nodes that the verifier enumerates. */
const padCount = (net: BooleanNetwork) => 23 - net.names.length;

/** The network with more nodes that read nothing and that nothing reads: above 22 nodes, same dynamics. */
function padded(net: BooleanNetwork, rng: () => number): BooleanNetwork {
  return checkNetwork({
    names: [...net.names, ...Array.from({ length: padCount(net) }, (_, i) => `pad${i}`)],
    regulators: [...net.regulators, ...Array.from({ length: padCount(net) }, () => new Int32Array(0))],
    tables: [...net.tables, ...Array.from({ length: padCount(net) }, () => Uint8Array.of(rng() < 0.5 ? 0 : 1))],
  });
}

/** Plain reference on the JSON: p(F^t(x)) = G(p(x)) for every state of the first n source nodes (pads at 0). */
function validByBruteForce(cert: ReturnType<typeof coarseGrainingCertificate>, n: number): boolean {
  const evalNet = (net: CertificateNetwork, value: Map<string, number>) =>
    new Map(
      net.nodes.map((node) => {
        const row = node.inputs.reduce((r, name, j) => r | (value.get(name)! << j), 0);
        return [node.name, Number(node.table[row])] as const;
      }),
    );
  if (cert.notion !== "coarse-graining") throw new Error("not a coarse-graining");
  const observe = (value: Map<string, number>) =>
    new Map(
      cert.witness.observables.map((o) => {
        const row = o.inputs.reduce((r, name, j) => r | (value.get(name)! << j), 0);
        return [o.target, Number(o.table[row])] as const;
      }),
    );
  for (let x = 0; x < 2 ** n; x++) {
    let state = new Map(cert.source.nodes.map((node, i) => [node.name, i < n ? (x >> i) & 1 : 0] as const));
    const start = state;
    for (let s = 0; s < cert.time; s++) state = evalNet(cert.source, state);
    const got = observe(state);
    const want = evalNet(cert.target, observe(start));
    for (const [name, v] of want) if (got.get(name) !== v) return false;
  }
  return true;
}

function flip(table: string, row: number): string {
  return table.slice(0, row) + (table[row] === "1" ? "0" : "1") + table.slice(row + 1);
}

const small = fc.record({
  n: fc.integer({ min: 1, max: 10 }),
  k: fc.integer({ min: 1, max: 3 }),
  t: fc.integer({ min: 1, max: 3 }),
  seed: fc.integer(),
  observed: fc.integer({ min: 1, max: 3 }),
});

function closingCase({
  n,
  k,
  t,
  seed,
  observed: count,
}: {
  n: number;
  k: number;
  t: number;
  seed: number;
  observed: number;
}) {
  const rng = seedrandom(`cone-${seed}`);
  const base = randomNetwork(rng, n, Math.min(k, n));
  const net = padded(base, rng);
  const observed = [...new Set(Array.from({ length: Math.min(count, n) }, () => Math.floor(rng() * n)))];
  const r = coarseGrainBySat(net, observed, t);
  return { rng, net, observed, r };
}

describe("verifyCertificate on coarse-grainings of sources above 22 nodes", () => {
  it("verifyCertificate accepts by cones exactly the closing coarse-grainings that brute force accepts, and states the cones", () => {
    fc.assert(
      fc.property(small, (c) => {
        const { net, observed, r, rng } = closingCase(c);
        const observables = observed.map((o) => nodeObservable(net, o));
        // A non-closing case gets a random target on the observed nodes, which brute force then refutes.
        const target =
          r.target ??
          checkNetwork({
            names: r.observed,
            regulators: r.observed.map(() => Int32Array.from(observed.keys())),
            tables: r.observed.map(() =>
              Uint8Array.from({ length: 2 ** observed.length }, () => (rng() < 0.5 ? 1 : 0)),
            ),
          });
        const cert = coarseGrainingCertificate(net, target, c.t, observables);
        const report = verifyCertificate(cert);
        expect(report.valid).toBe(validByBruteForce(cert, c.n));
        expect(report.valid).toBe(r.closes);
        if (report.valid) {
          expect(report.cones!.map((x) => x.target)).toEqual(r.observed);
          if (cert.notion === "coarse-graining") expect(cert.witness.cones).toEqual(report.cones);
        }
      }),
      { seed: 7701, numRuns: 150 },
    );
  });

  it("verifyCertificate rejects a tampered certificate exactly when brute force does", () => {
    fc.assert(
      fc.property(small, fc.integer({ min: 0, max: 3 }), fc.nat(), (c, what, pick) => {
        const { net, observed, r } = closingCase(c);
        fc.pre(r.closes);
        const cert = coarseGrainingCertificate(
          net,
          r.target!,
          c.t,
          observed.map((o) => nodeObservable(net, o)),
        );
        if (cert.notion !== "coarse-graining") throw new Error("not a coarse-graining");
        const copy = structuredClone(cert);
        if (what === 0) {
          const node = copy.target.nodes[pick % copy.target.nodes.length]!;
          (node as { table: string }).table = flip(node.table, pick % node.table.length);
        } else if (what === 1) {
          const node = copy.source.nodes[pick % c.n]!;
          (node as { table: string }).table = flip(node.table, pick % node.table.length);
        } else if (what === 2) {
          const o = copy.witness.observables[pick % copy.witness.observables.length]!;
          (o as { table: string }).table = flip(o.table, pick % o.table.length);
        } else {
          const cone = copy.witness.cones![pick % copy.witness.cones!.length]!;
          (cone as { support: string[] }).support = [...cone.support, "pad0"];
        }
        const report = verifyCertificate(copy);
        if (what === 3) expect(report.problems[0]).toMatch(/stated support/);
        else expect(report.valid).toBe(validByBruteForce(copy, c.n));
        // A refused state is genuine: it is a whole source state the brute-force reference can re-check.
        if (!report.valid && what < 3) expect(report.problems[0]).toMatch(/^source state [01]+: after/);
      }),
      { seed: 7702, numRuns: 200 },
    );
  });

  it("checkCone decides every target node the same way by SAT as by its truth table", () => {
    fc.assert(
      fc.property(small, (c) => {
        const { net, observed, r, rng } = closingCase(c);
        const wordNet = (x: BooleanNetwork) => ({
          names: x.names,
          inputs: x.regulators.map((reg) => Array.from(reg)),
          tables: x.tables,
        });
        const target =
          r.target ??
          checkNetwork({
            names: r.observed,
            regulators: r.observed.map(() => Int32Array.from(observed.keys())),
            tables: r.observed.map(() =>
              Uint8Array.from({ length: 2 ** observed.length }, () => (rng() < 0.5 ? 1 : 0)),
            ),
          });
        const obs = observed.map((o) => ({ inputs: [o], table: Uint8Array.of(0, 1) }));
        const F = wordNet(net);
        const G = wordNet(target);
        target.names.forEach((_, j) => {
          const plan = planCone(F, G, obs, j, c.t);
          const byTable = checkCone(F, G, obs, j, c.t, { ...plan, method: "table" });
          const bySat = checkCone(F, G, obs, j, c.t, { ...plan, method: "sat" });
          expect(bySat === null).toBe(byTable === null);
        });
      }),
      { seed: 7703, numRuns: 100 },
    );
  });

  it("verifyCertificate checks by SAT a cone of more than 20 source nodes and refutes a wrong target", () => {
    // Planted: a' = a, written with a second input b that the table ignores; b and everything upstream are 200
    // noise nodes of in-degree 4, so at t = 4 the cone of a spans far more than 20 nodes while a keeps its value.
    const rng = seedrandom("wide-cone");
    const noise = randomNetwork(rng, 200, 4);
    const b = noise.regulators.findIndex((r, i) => i > 0 && r.length === 4);
    const net = checkNetwork({
      names: ["a", ...noise.names.slice(1)],
      regulators: [Int32Array.of(0, b), ...noise.regulators.slice(1)],
      tables: [Uint8Array.of(0, 1, 0, 1), ...noise.tables.slice(1)],
    });
    const r = coarseGrainBySat(net, [0], 4);
    expect(r.closes).toBe(true);
    const cert = coarseGrainingCertificate(net, r.target!, 4, [nodeObservable(net, 0)]);
    const report = verifyCertificate(cert);
    expect(report.valid).toBe(true);
    expect(report.cones![0]!.method).toBe("sat");
    expect(report.cones![0]!.support.length).toBeGreaterThan(20);
    const wrong = {
      ...cert,
      target: networkToCertificate(
        checkNetwork({ names: ["a"], regulators: [Int32Array.of(0)], tables: [Uint8Array.of(1, 0)] }),
      ),
    };
    const refuted = verifyCertificate(wrong);
    expect(refuted.valid).toBe(false);
    expect(refuted.problems[0]).toMatch(/observable "a" is [01] but the target predicts [01]/);
  });
});
