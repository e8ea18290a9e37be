import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { checkNetwork, networkFromFunctions, type BooleanNetwork } from "../network";
import { networkFromSuccessors, plantEmulation, powerTable, randomNetwork, successorsOfNetwork } from "../emulation";
import { findDynamicalEmbedding } from "../embedding";
import { nodeObservable } from "../coarse-graining";
import {
  blockEmulationCertificate,
  coarseGrainingCertificate,
  composeCertificates,
  embeddingCertificate,
  networkFromCertificate,
  networkToCertificate,
  verifyCertificate,
  type ReductionCertificate,
} from "./index";

// a' = b, b' = a: the swap is the identity at t = 2 (its period).
const swap = networkFromFunctions(["a", "b"], [[1], [0]], (_n, x) => x[0]!);
const keep = networkFromFunctions(["g"], [[0]], (_n, x) => x[0]!);
const identityBlocks = (net: BooleanNetwork, time: number) =>
  blockEmulationCertificate(net, net, {
    time,
    blocks: net.names.map((_, v) => ({ nodes: [v], zero: [0], one: [1] })),
    context: net.names.map(() => -1),
  });

/** Flip one output bit of one target node's table. */
function corruptTarget(cert: ReductionCertificate, node: number, row: number): ReductionCertificate {
  const nodes = cert.target.nodes.map((x, i) =>
    i === node
      ? { ...x, table: x.table.slice(0, row) + (x.table[row] === "1" ? "0" : "1") + x.table.slice(row + 1) }
      : x,
  );
  return { ...cert, target: { nodes } } as ReductionCertificate;
}

describe("verifyCertificate", () => {
  it("verifyCertificate accepts the swap emulating a kept bit at t = 2 and rejects it at t = 1", () => {
    const w = { time: 2, blocks: [{ nodes: [0], zero: [0], one: [1] }], context: [-1, 1] };
    expect(verifyCertificate(blockEmulationCertificate(swap, keep, w))).toEqual({
      valid: true,
      notion: "block-emulation",
      time: 2,
      problems: [],
      statesChecked: 2,
    });
    const r = verifyCertificate(blockEmulationCertificate(swap, keep, { ...w, time: 1 }));
    expect(r.valid).toBe(false);
    expect(r.problems[0]).toMatch(/target state 0: F\^1\(e\(x\)\) = 10 but e\(G\(x\)\) = 01/);
  });

  it("verifyCertificate reports malformed certificates instead of throwing", () => {
    const good = blockEmulationCertificate(swap, keep, {
      time: 2,
      blocks: [{ nodes: [0], zero: [0], one: [1] }],
      context: [-1, 1],
    });
    const bad = (patch: Record<string, unknown>) => verifyCertificate({ ...good, ...patch });
    expect(verifyCertificate(null).problems).toEqual(["a certificate must be a JSON object"]);
    expect(bad({ version: 2 }).problems).toEqual(['"version" must be 1']);
    expect(bad({ time: 0 }).valid).toBe(false);
    expect(bad({ notion: "isomorphism" }).problems).toEqual(['unknown notion "isomorphism"']);
    expect(
      bad({ witness: { blocks: [{ target: "g", nodes: ["a"], zero: "1", one: "1" }], context: { b: 1 } } }).problems,
    ).toEqual(['the two codewords of "g" are equal']);
    expect(
      bad({ witness: { blocks: [{ target: "g", nodes: ["a"], zero: "0", one: "1" }], context: {} } }).problems,
    ).toEqual(['source node "b" is neither in a block nor in the context']);
    expect(
      bad({ witness: { blocks: [{ target: "g", nodes: ["a"], zero: "0", one: "1" }], context: { a: 1, b: 1 } } })
        .problems,
    ).toEqual(['source node "a" is both in a block and in the context']);
    expect(
      bad({ witness: { blocks: [{ target: "g", nodes: ["z"], zero: "0", one: "1" }], context: { b: 1 } } }).problems,
    ).toEqual(['block of "g" uses unknown source node "z"']);
    expect(
      bad({
        source: {
          nodes: [
            { name: "a", inputs: ["b"], table: "011" },
            { name: "b", inputs: [], table: "0" },
          ],
        },
      }).problems,
    ).toEqual(['source node "a" table must be a 0/1 string of length 2']);
    const embedding = embeddingCertificate(swap, keep, 2, [1, 1]);
    expect(verifyCertificate(embedding).problems).toEqual(["two target states map to source state 10"]);
  });

  it("verifyCertificate rejects every certificate whose target table is changed in one row (block emulation and embedding)", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 1, max: 3 }), fc.nat(), fc.nat(), (seed, m, a, b) => {
        const rng = seedrandom(String(seed));
        const G = randomNetwork(rng, m, 2, "g");
        const { source, witness } = plantEmulation(rng, G, m * 2 + 3, 2);
        const block = blockEmulationCertificate(source, G, witness);
        const embed = findDynamicalEmbedding(source, G, 1);
        const cert2 = embeddingCertificate(source, G, 1, embed.map!);
        expect(verifyCertificate(block).valid).toBe(true);
        expect(verifyCertificate(cert2).valid).toBe(true);
        const node = a % m;
        const row = b % G.tables[node]!.length;
        expect(verifyCertificate(corruptTarget(block, node, row)).valid).toBe(false);
        expect(verifyCertificate(corruptTarget(cert2, node, row)).valid).toBe(false);
      }),
      { seed: 1101, numRuns: 40 },
    );
  });

  it("networkFromCertificate reads back what networkToCertificate wrote", () => {
    const net = randomNetwork(seedrandom("1102"), 6, 3);
    expect(networkFromCertificate(networkToCertificate(net))).toEqual(net);
  });
});

describe("composeCertificates", () => {
  it("composeCertificates chains two planted block emulations into one the verifier accepts, multiplying the time scales", () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer({ min: 1, max: 2 }), fc.integer({ min: 1, max: 3 }), (seed, m, t2) => {
        const rng = seedrandom(String(seed));
        const H = randomNetwork(rng, m, 2, "h");
        const mid = plantEmulation(rng, H, m * 2 + 1, 2);
        const top = plantEmulation(rng, mid.source, mid.source.names.length * 2 + 2, 2);
        // G emulates G^t2 at time t2 with one-node blocks, so the chain F -> G -> G^t2 has time 1 * t2.
        const G = mid.source;
        const Gt = networkFromSuccessors(
          G.names.map((x) => `${x}^${t2}`),
          powerTable(successorsOfNetwork(G), t2),
        );
        const second = blockEmulationCertificate(G, Gt, {
          time: t2,
          blocks: G.names.map((_, v) => ({ nodes: [v], zero: [0], one: [1] })),
          context: G.names.map(() => -1),
        });
        expect(verifyCertificate(second).valid).toBe(true);
        const first = blockEmulationCertificate(top.source, G, top.witness);
        const composed = composeCertificates(first, second);
        expect(composed.time).toBe(t2);
        expect(verifyCertificate(composed).valid).toBe(true);
        const chain = composeCertificates(first, blockEmulationCertificate(G, H, mid.witness));
        expect(chain.notion).toBe("block-emulation");
        expect(verifyCertificate(chain).valid).toBe(true);
      }),
      { seed: 1201, numRuns: 40 },
    );
  });

  it("composeCertificates turns a block emulation followed by an embedding into a verified embedding", () => {
    const rng = seedrandom("1202");
    const H = randomNetwork(rng, 2, 2, "h");
    const mid = plantEmulation(rng, H, 5, 2);
    const top = plantEmulation(rng, mid.source, 12, 2);
    const embed = findDynamicalEmbedding(mid.source, H, 1);
    const composed = composeCertificates(
      blockEmulationCertificate(top.source, mid.source, top.witness),
      embeddingCertificate(mid.source, H, 1, embed.map!),
    );
    expect(composed.notion).toBe("dynamical-embedding");
    expect(verifyCertificate(composed).valid).toBe(true);
  });

  it("composeCertificates chains two coarse-grainings through composed observables", () => {
    // F: a' = b xor c, b' = a, c' = c, d' = a and d.
    const F = networkFromFunctions(["a", "b", "c", "d"], [[1, 2], [0], [2], [0, 3]], (node, v) =>
      node === 0 ? v[0]! ^ v[1]! : node === 3 ? v[0]! & v[1]! : v[0]!,
    );
    // Observing x = a, y = b xor c and z = c closes: x' = y, y' = a xor c = x xor z, z' = z.
    const G = networkFromFunctions(["x", "y", "z"], [[1], [0, 2], [2]], (node, v) =>
      node === 1 ? v[0]! ^ v[1]! : v[0]!,
    );
    const observables = [
      { inputs: [0], table: Uint8Array.of(0, 1) },
      { inputs: [1, 2], table: Uint8Array.of(0, 1, 1, 0) },
      { inputs: [2], table: Uint8Array.of(0, 1) },
    ];
    const first = coarseGrainingCertificate(F, G, 1, observables);
    expect(verifyCertificate(first).valid).toBe(true);
    // G observed on z alone: z' = z.
    const H = networkFromFunctions(["z"], [[0]], (_n, v) => v[0]!);
    const second = coarseGrainingCertificate(G, H, 1, [nodeObservable(G, 2)]);
    expect(verifyCertificate(second).valid).toBe(true);
    const composed = composeCertificates(first, second);
    expect(composed.notion).toBe("coarse-graining");
    expect(verifyCertificate(composed).valid).toBe(true);
    expect(() => composeCertificates(second, first)).toThrow(/target is not the second certificate's source/);
    expect(() => composeCertificates(first, identityBlocks(G, 1))).toThrow(/coarse-graining composes only/);
  });

  it("identity block certificates compose with anything without changing what is verified (common practice)", () => {
    const rng = seedrandom("1203");
    const H = randomNetwork(rng, 2, 2, "h");
    const { source, witness } = plantEmulation(rng, H, 6, 2);
    const cert = blockEmulationCertificate(source, H, witness);
    const left = composeCertificates(identityBlocks(source, 1), cert);
    const right = composeCertificates(cert, identityBlocks(H, 1));
    expect(verifyCertificate(left).valid).toBe(true);
    expect(verifyCertificate(right).valid).toBe(true);
    expect(right.witness).toEqual(cert.witness);
    expect(checkNetwork(networkFromCertificate(left.source)).names).toEqual(source.names);
  });
});
