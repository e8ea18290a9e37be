// Node-elimination and constant-percolation certificates: the engine's reductions keep what they state (checked
// against every state of small random networks), the independent verifier accepts the engine's certificates, and it
// rejects them once mutated. References: Naldi, Remy, Thieffry, Chaouiya, "Dynamically consistent reduction of
// logical regulatory graphs", Theoretical Computer Science 2011, and Veliz-Cuba, "Reduction of Boolean network
// models", Journal of Theoretical Biology 2011 (fixed points one to one under elimination); percolation of constants
// keeping every attractor is common practice (the percolation step of trap-space methods).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { EngineError } from "../errors";
import { eliminateNodes, eligibleNodes, percolateConstants } from "../elimination";
import type { BooleanNetwork } from "../network";
import { compileDefinition, readRuleText } from "../rules";
import { randomNK, slowSuccessor, text } from "../update/random-networks.test-support";
import {
  eliminationCertificate,
  percolationCertificate,
  type CertificateNetwork,
  type ReductionCertificate,
} from "./certificate-format";
import { composeCertificates } from "./compose-certificates";
import { verifyCertificate } from "./verify-certificate";

const rules = (t: string) => compileDefinition(readRuleText(t));

function fixedPoints(net: BooleanNetwork): string[] {
  const n = net.names.length;
  const out: string[] = [];
  for (let x = 0; x < 2 ** n; x++) if (slowSuccessor(net, x) === x) out.push(text(x, n));
  return out;
}

/** Synchronous attractors by walking from every state until a state repeats (plainly correct, for n <= 10). */
function attractorCount(net: BooleanNetwork): number {
  const n = net.names.length;
  const cycles = new Set<number>();
  for (let x = 0; x < 2 ** n; x++) {
    const seen = new Set<number>();
    let s = x;
    while (!seen.has(s)) (seen.add(s), (s = slowSuccessor(net, s)));
    // Name each cycle by its smallest state.
    let least = s;
    for (let t = slowSuccessor(net, s); t !== s; t = slowSuccessor(net, t)) least = Math.min(least, t);
    cycles.add(least);
  }
  return cycles.size;
}

function projected(original: BooleanNetwork, reduced: BooleanNetwork): string[] {
  const at = reduced.names.map((name) => original.names.indexOf(name));
  return fixedPoints(original).map((s) => at.map((i) => s[i]).join(""));
}

/** The network with the held nodes' rules replaced by their constants. */
function withHeld(net: BooleanNetwork, held: Record<string, 0 | 1>): BooleanNetwork {
  return {
    ...net,
    regulators: net.regulators.map((r, i) => (net.names[i]! in held ? new Int32Array(0) : r)),
    tables: net.tables.map((t, i) => (net.names[i]! in held ? Uint8Array.of(held[net.names[i]!]!) : t)),
  };
}

const cases = fc.record({
  n: fc.integer({ min: 2, max: 10 }),
  k: fc.integer({ min: 1, max: 3 }),
  seed: fc.integer(),
  pick: fc.array(fc.nat(), { minLength: 1, maxLength: 10 }),
});

function elimination(c: { n: number; k: number; seed: number }) {
  const net = randomNK(c.n, Math.min(c.k, c.n), c.seed);
  const r = eliminateNodes(net, "all-eligible");
  return { net, r, cert: eliminationCertificate(net, r.network, r.eliminated) };
}

/** The same nodes with the same update on every state (regulator lists may differ in order). */
function sameFunctions(a: BooleanNetwork, b: BooleanNetwork): boolean {
  if (a.names.join() !== b.names.join()) return false;
  for (let x = 0; x < 2 ** a.names.length; x++) if (slowSuccessor(a, x) !== slowSuccessor(b, x)) return false;
  return true;
}

function flipBit(target: CertificateNetwork, node: number, row: number): CertificateNetwork {
  return {
    nodes: target.nodes.map((x, j) => {
      if (j !== node) return x;
      const r = row % x.table.length;
      return { ...x, table: x.table.slice(0, r) + (x.table[r] === "1" ? "0" : "1") + x.table.slice(r + 1) };
    }),
  };
}

describe("node-elimination certificates", () => {
  it("the engine's elimination keeps the fixed points one to one and the verifier accepts its certificate", () => {
    fc.assert(
      fc.property(cases, (c) => {
        const { net, r, cert } = elimination(c);
        if (r.eliminated.length === 0 || r.network.names.length === 0) return;
        const image = projected(net, r.network);
        expect(new Set(image).size).toBe(image.length);
        expect(image.sort()).toEqual(fixedPoints(r.network).sort());
        const report = verifyCertificate(JSON.parse(JSON.stringify(cert)));
        expect(report.problems).toEqual([]);
        expect(report.valid).toBe(true);
      }),
      { seed: 4101, numRuns: 150 },
    );
  });

  it("the verifier rejects a certificate with one target table bit flipped", () => {
    fc.assert(
      fc.property(cases, (c) => {
        const { r, cert } = elimination(c);
        if (r.eliminated.length === 0 || r.network.names.length === 0) return;
        const j = c.pick[0]! % cert.target.nodes.length;
        const bad = { ...cert, target: flipBit(cert.target, j, c.pick[1] ?? 0) };
        expect(verifyCertificate(bad).valid).toBe(false);
      }),
      { seed: 4102, numRuns: 150 },
    );
  });

  it("the verifier rejects a certificate with one eliminated node dropped from the witness", () => {
    fc.assert(
      fc.property(cases, (c) => {
        const { r, cert } = elimination(c);
        if (r.eliminated.length < 2 || r.network.names.length === 0) return;
        const drop = c.pick[0]! % r.eliminated.length;
        const bad: ReductionCertificate = {
          ...cert,
          notion: "node-elimination",
          witness: { eliminated: r.eliminated.filter((_, i) => i !== drop) },
        };
        expect(verifyCertificate(bad).valid).toBe(false);
      }),
      { seed: 4103, numRuns: 150 },
    );
  });

  it("a reordered witness is accepted exactly when eliminating in that order gives the same target", () => {
    let rejected = 0;
    fc.assert(
      fc.property(cases, (c) => {
        const { net, r, cert } = elimination(c);
        if (r.eliminated.length < 2 || r.network.names.length === 0) return;
        const i = c.pick[0]! % r.eliminated.length;
        const j = (i + 1 + ((c.pick[1] ?? 0) % (r.eliminated.length - 1))) % r.eliminated.length;
        const order = [...r.eliminated];
        [order[i], order[j]] = [order[j]!, order[i]!];
        let same = false;
        try {
          same = sameFunctions(eliminateNodes(net, order).network, r.network);
        } catch (e) {
          if (!(e instanceof EngineError)) throw e;
        }
        const report = verifyCertificate({ ...cert, witness: { eliminated: order } });
        expect(report.valid).toBe(same);
        if (!report.valid) rejected++;
      }),
      { seed: 4104, numRuns: 200 },
    );
    // The property must have met reorderings that break the certificate, or it checked only one side.
    expect(rejected).toBeGreaterThan(0);
  });

  it("two eliminations in a row compose into one certificate the verifier accepts", () => {
    fc.assert(
      fc.property(cases, (c) => {
        const { net, r } = elimination(c);
        if (r.eliminated.length < 2 || r.network.names.length === 0) return;
        const half = r.eliminated.slice(0, Math.ceil(r.eliminated.length / 2));
        const middle = eliminateNodes(net, half).network;
        const rest = r.eliminated.filter((name) => !half.includes(name));
        const last = eliminateNodes(middle, rest).network;
        const composed = composeCertificates(
          eliminationCertificate(net, middle, half),
          eliminationCertificate(middle, last, rest),
        );
        expect(verifyCertificate(composed).problems).toEqual([]);
      }),
      { seed: 4105, numRuns: 100 },
    );
  });

  it("the verifier rejects eliminating a node that regulates itself at its turn", () => {
    // a' = !b, b' = a: after a is eliminated b' = !b reads b itself.
    const net = rules("a' = !b\nb' = a\nc' = b\n");
    const target = rules("c' = b\nb' = b\n");
    const cert = eliminationCertificate(net, target, ["a", "b"]);
    const report = verifyCertificate(cert);
    expect(report.valid).toBe(false);
    expect(report.problems[0]).toMatch(/"b" regulates itself at its turn \(step 2\)/);
  });

  it("eligibleNodes leaves out exactly the nodes whose function reads their own value", () => {
    const net = rules("a' = a | b\nb' = !a\n");
    expect(eligibleNodes(net)).toEqual(["b"]);
  });
});

describe("constant-percolation certificates", () => {
  function percolation(c: { n: number; k: number; seed: number; pick: number[] }) {
    const net = randomNK(c.n, Math.min(c.k, c.n), c.seed);
    // Hold up to two nodes picked by the case, at the parity of the pick.
    const held: Record<string, 0 | 1> = Object.fromEntries(
      c.pick.slice(0, 2).map((p) => [net.names[p % c.n]!, (p % 2) as 0 | 1] as const),
    );
    const r = percolateConstants(net, held);
    return { net, held, r, cert: percolationCertificate(net, r.network, held, r.fixed) };
  }

  it("percolation keeps the number of attractors and the fixed points, and the verifier accepts it", () => {
    fc.assert(
      fc.property(cases, (c) => {
        const { net, held, r, cert } = percolation(c);
        const source = withHeld(net, held);
        if (r.network.names.length === 0) {
          // Everything fixed: one attractor, the fixed point of the stated values.
          expect(attractorCount(source)).toBe(1);
          expect(fixedPoints(source)).toEqual([net.names.map((name) => String(r.fixed[name])).join("")]);
          return;
        }
        expect(attractorCount(r.network)).toBe(attractorCount(source));
        const image = projected(source, r.network);
        expect(new Set(image).size).toBe(image.length);
        expect(image.sort()).toEqual(fixedPoints(r.network).sort());
        const report = verifyCertificate(JSON.parse(JSON.stringify(cert)));
        expect(report.problems).toEqual([]);
      }),
      { seed: 4201, numRuns: 150 },
    );
  });

  it("the verifier rejects a flipped fixed value, a dropped fixed node and a flipped target bit", () => {
    fc.assert(
      fc.property(cases, (c) => {
        const { r, cert } = percolation(c);
        if (r.network.names.length === 0 || cert.notion !== "constant-percolation") return;
        const names = Object.keys(r.fixed);
        const name = names[c.pick[0]! % names.length]!;
        // Holding a node at the other value is another statement, which may hold as well: only forced ones flip.
        if (!Object.hasOwn(cert.witness.held, name)) {
          const flipped = { ...r.fixed, [name]: r.fixed[name] === 1 ? 0 : 1 };
          expect(verifyCertificate({ ...cert, witness: { held: cert.witness.held, fixed: flipped } }).valid).toBe(
            false,
          );
        }
        const dropped = Object.fromEntries(Object.entries(r.fixed).filter(([k]) => k !== name));
        const heldDropped = Object.fromEntries(Object.entries(cert.witness.held).filter(([k]) => k !== name));
        expect(verifyCertificate({ ...cert, witness: { held: heldDropped, fixed: dropped } }).valid).toBe(false);
        const j = (c.pick[1] ?? 0) % cert.target.nodes.length;
        expect(verifyCertificate({ ...cert, target: flipBit(cert.target, j, c.pick[2] ?? 0) }).valid).toBe(false);
      }),
      { seed: 4202, numRuns: 150 },
    );
  });

  it("the verifier rejects a fixed value that nothing forces", () => {
    const net = rules("a' = 1\nb' = a & c\nc' = b\n");
    // b is not forced: with a = 1 it copies c.
    const cert = percolationCertificate(net, rules("c' = c\n"), {}, { a: 1, b: 0 });
    const report = verifyCertificate(cert);
    expect(report.valid).toBe(false);
    expect(report.problems[0]).toMatch(/value of "b" is not forced/);
  });
});
