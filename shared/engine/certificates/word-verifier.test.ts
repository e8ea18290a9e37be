// The verifier simulates 32 states per word; here it is compared with a plain one-state-at-a-time reference on
// random certificates of all three notions, valid (identity witnesses, powers of the swap) and mostly invalid ones.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { verifyCertificate } from "./index";

interface RefNode {
  name: string;
  inputs: string[];
  table: string;
}

function refStep(nodes: RefNode[], s: number[]): number[] {
  const at = new Map(nodes.map((x, i) => [x.name, i] as const));
  return nodes.map((x) => {
    let row = 0;
    x.inputs.forEach((name, j) => (row += s[at.get(name)!]! * 2 ** j));
    return x.table[row] === "1" ? 1 : 0;
  });
}

function refRun(nodes: RefNode[], s: number[], t: number): number[] {
  for (let k = 0; k < t; k++) s = refStep(nodes, s);
  return s;
}

const states = (length: number) =>
  Array.from({ length: 2 ** length }, (_, x) => Array.from({ length }, (_, i) => Math.floor(x / 2 ** i) % 2));

/** The first failing state in state order, in the verifier's wording, or null when the certificate is valid. */
function refProblem(cert: {
  notion: string;
  time: number;
  source: { nodes: RefNode[] };
  target: { nodes: RefNode[] };
  witness: Record<string, unknown>;
}): string | null {
  const F = cert.source.nodes;
  const G = cert.target.nodes;
  const t = cert.time;
  const text = (s: number[]) => s.join("");
  if (cert.notion === "coarse-graining") {
    const obs = cert.witness.observables as { target: string; inputs: string[]; table: string }[];
    const p = (s: number[]) =>
      G.map((g) => {
        const o = obs.find((q) => q.target === g.name)!;
        let row = 0;
        o.inputs.forEach((name, j) => (row += s[F.findIndex((f) => f.name === name)]! * 2 ** j));
        return o.table[row] === "1" ? 1 : 0;
      });
    for (const x of states(F.length)) {
      const got = p(refRun(F, x, t));
      const want = refStep(G, p(x));
      if (text(got) !== text(want))
        return `source state ${text(x)}: p(F^${t}(x)) = ${text(got)} but G(p(x)) = ${text(want)}`;
    }
    return null;
  }
  let e: (x: number[]) => number[];
  if (cert.notion === "dynamical-embedding") {
    const map = cert.witness.map as Record<string, string>;
    e = (x) => Array.from(map[text(x)]!, Number);
  } else {
    const blocks = cert.witness.blocks as { target: string; nodes: string[]; zero: string; one: string }[];
    const context = cert.witness.context as Record<string, number>;
    e = (x) =>
      F.map((f) => {
        if (Object.hasOwn(context, f.name)) return context[f.name]!;
        const b = blocks.find((q) => q.nodes.includes(f.name))!;
        const word = x[G.findIndex((g) => g.name === b.target)] ? b.one : b.zero;
        return Number(word[b.nodes.indexOf(f.name)]);
      });
  }
  for (const x of states(G.length)) {
    const got = refRun(F, e(x), t);
    const want = e(refStep(G, x));
    if (text(got) !== text(want))
      return `target state ${text(x)}: F^${t}(e(x)) = ${text(got)} but e(G(x)) = ${text(want)}`;
  }
  return null;
}

const network = (prefix: string, size: number, maxInputs: number) =>
  fc
    .array(
      fc.record({
        inputs: fc.uniqueArray(fc.nat(size - 1), { maxLength: maxInputs }),
        seed: fc.array(fc.boolean(), { minLength: 2 ** maxInputs, maxLength: 2 ** maxInputs }),
      }),
      { minLength: size, maxLength: size },
    )
    .map((nodes) =>
      nodes.map((x, i) => ({
        name: `${prefix}${i}`,
        inputs: x.inputs.map((k) => `${prefix}${k}`),
        table: x.seed
          .slice(0, 2 ** x.inputs.length)
          .map((b) => (b ? "1" : "0"))
          .join(""),
      })),
    );

const base = { format: "emulant-reduction", version: 1 } as const;

const blockCertificate = fc
  .tuple(fc.integer({ min: 1, max: 3 }), fc.integer({ min: 0, max: 4 }), fc.integer({ min: 1, max: 4 }))
  .chain(([m, extra, time]) => {
    const n = m + extra;
    return fc
      .record({
        source: network("f", n, 3),
        target: network("g", m, 2),
        owner: fc.array(fc.integer({ min: -1, max: m - 1 }), { minLength: n, maxLength: n }),
        words: fc.array(fc.boolean(), { minLength: 2 * n, maxLength: 2 * n }),
        identity: fc.boolean(),
      })
      .map(({ source, target, owner, words, identity }) => {
        if (identity) {
          // F emulates itself at time 1 with one-node blocks and an empty context.
          const g = source.map((x) => ({ ...x, name: `g${x.name}`, inputs: x.inputs.map((i) => `g${i}`) }));
          return {
            ...base,
            notion: "block-emulation",
            time: 1,
            source: { nodes: source },
            target: { nodes: g },
            witness: {
              blocks: source.map((x) => ({ target: `g${x.name}`, nodes: [x.name], zero: "0", one: "1" })),
              context: {},
            },
          };
        }
        // Nodes 0..m-1 start the m blocks; the rest join a block or the context as drawn.
        const of = owner.map((o, v) => (v < m ? v : o));
        const blocks = target.map((g, j) => {
          const nodes = source.filter((_, v) => of[v] === j);
          const zero = nodes.map((x) => (words[source.indexOf(x)] ? "1" : "0")).join("");
          let one = nodes.map((x) => (words[n + source.indexOf(x)] ? "1" : "0")).join("");
          if (one === zero) one = (zero[0] === "1" ? "0" : "1") + zero.slice(1);
          return { target: g.name, nodes: nodes.map((x) => x.name), zero, one };
        });
        const context = Object.fromEntries(
          source.flatMap((x, v) => (of[v] === -1 ? [[x.name, words[v] ? 1 : 0]] : [])),
        );
        return {
          ...base,
          notion: "block-emulation",
          time,
          source: { nodes: source },
          target: { nodes: target },
          witness: { blocks, context },
        };
      });
  });

const embeddingCertificate = fc
  .tuple(fc.integer({ min: 1, max: 3 }), fc.integer({ min: 0, max: 3 }), fc.integer({ min: 1, max: 3 }))
  .chain(([m, extra, time]) =>
    fc
      .record({
        source: network("f", m + extra, 3),
        target: network("g", m, 2),
        images: fc.uniqueArray(fc.nat(2 ** (m + extra) - 1), { minLength: 2 ** m, maxLength: 2 ** m }),
      })
      .map(({ source, target, images }) => ({
        ...base,
        notion: "dynamical-embedding",
        time,
        source: { nodes: source },
        target: { nodes: target },
        witness: {
          map: Object.fromEntries(
            states(m).map((x, k) => [x.join(""), states(m + extra)[images[k]!]!.join("")] as const),
          ),
        },
      })),
  );

const coarseCertificate = fc
  .tuple(fc.integer({ min: 1, max: 10 }), fc.integer({ min: 1, max: 3 }), fc.integer({ min: 1, max: 3 }))
  .chain(([n, m, time]) =>
    fc
      // Sources of 9 and 10 nodes get nodes of up to 10 inputs: tables too wide to fold, evaluated lane by lane.
      .record({ source: network("f", n, n >= 9 ? 10 : 3), target: network("g", m, 2), observed: network("f", m, 2) })
      .map(({ source, target, observed }) => ({
        ...base,
        notion: "coarse-graining",
        time,
        source: { nodes: source },
        target: { nodes: target },
        witness: {
          observables: target.map((g, j) => ({
            target: g.name,
            inputs: observed[j]!.inputs.filter((name) => Number(name.slice(1)) < n),
            table: observed[j]!.table.slice(
              0,
              2 ** observed[j]!.inputs.filter((name) => Number(name.slice(1)) < n).length,
            ),
          })),
        },
      })),
  );

describe("verifyCertificate against a one-state-at-a-time reference", () => {
  it("verifyCertificate gives the reference's verdict and first failing state for every notion", () => {
    fc.assert(
      fc.property(fc.oneof(blockCertificate, embeddingCertificate, coarseCertificate), (cert) => {
        const want = refProblem(cert as Parameters<typeof refProblem>[0]);
        const got = verifyCertificate(cert);
        expect(got.problems).toEqual(want === null ? [] : [want]);
        expect(got.valid).toBe(want === null);
      }),
      { seed: 1616, numRuns: 400 },
    );
  });
});
