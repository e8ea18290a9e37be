// Composition of reductions: F -> G at time t1 and G -> H at time t2 give F -> H at time t1*t2 (block encodings
// substitute into each other, injective maps compose, observables compose), the transitivity behind a hierarchy of
// models (as in the composition of block emulations in Ollinger, Theoretical Computer Science, 2003).
import { EngineError } from "../errors";
import {
  CERTIFICATE_FORMAT,
  CERTIFICATE_VERSION,
  type BlockEmulationWitnessJson,
  type CertificateBlock,
  type CertificateNetwork,
  type CertificateObservable,
  type ReductionCertificate,
} from "./certificate-format";

function sameNetwork(a: CertificateNetwork, b: CertificateNetwork): boolean {
  return (
    JSON.stringify(a.nodes.map((x) => [x.name, x.inputs, x.table])) ===
    JSON.stringify(b.nodes.map((x) => [x.name, x.inputs, x.table]))
  );
}

/** The encoding of a block-emulation certificate as a map of state strings (target order -> source order). */
function blockEncoder(cert: ReductionCertificate & { notion: "block-emulation" }): (x: string) => string {
  const names = cert.source.nodes.map((node) => node.name);
  const targetIndex = new Map(cert.target.nodes.map((node, i) => [node.name, i] as const));
  return (x) => {
    const values = new Map<string, string>(Object.entries(cert.witness.context).map(([k, v]) => [k, String(v)]));
    for (const b of cert.witness.blocks) {
      const word = x[targetIndex.get(b.target)!] === "1" ? b.one : b.zero;
      b.nodes.forEach((name, i) => values.set(name, word[i]!));
    }
    return names.map((name) => values.get(name) ?? "0").join("");
  };
}

function encoder(cert: ReductionCertificate): (x: string) => string {
  if (cert.notion === "block-emulation") return blockEncoder(cert);
  if (cert.notion === "dynamical-embedding") {
    const map = cert.witness.map;
    return (x) => {
      const y = map[x];
      if (y === undefined) throw new EngineError("BAD_CERTIFICATE", `the embedding has no image for ${x}`);
      return y;
    };
  }
  throw new EngineError("NOT_COMPOSABLE", "a coarse-graining is not an injective encoding");
}

function allStrings(m: number): string[] {
  const out: string[] = [];
  for (let x = 0; x < 2 ** m; x++) {
    let s = "";
    for (let i = 0; i < m; i++) s += (Math.floor(x / 2 ** i) % 2).toString();
    out.push(s);
  }
  return out;
}

/** Compose F -> G (first) with G -> H (second) into F -> H; the result should be confirmed with verifyCertificate. */
export function composeCertificates(first: ReductionCertificate, second: ReductionCertificate): ReductionCertificate {
  if (!sameNetwork(first.target, second.source)) {
    throw new EngineError("NOT_COMPOSABLE", "the first certificate's target is not the second certificate's source");
  }
  const base = {
    format: CERTIFICATE_FORMAT,
    version: CERTIFICATE_VERSION,
    time: first.time * second.time,
    source: first.source,
    target: second.target,
  } as const;
  if (first.notion === "block-emulation" && second.notion === "block-emulation") {
    return { ...base, notion: "block-emulation", witness: composeBlocks(first.witness, second.witness) };
  }
  if (first.notion === "coarse-graining" && second.notion === "coarse-graining") {
    return {
      ...base,
      notion: "coarse-graining",
      witness: { observables: composeObservables(first, second.witness.observables) },
    };
  }
  // Substitutions in a row are one substitution: the second continues where the first stopped.
  if (first.notion === "node-elimination" && second.notion === "node-elimination")
    return {
      ...base,
      notion: "node-elimination",
      witness: { eliminated: [...first.witness.eliminated, ...second.witness.eliminated] },
    };
  if (first.notion === "constant-percolation" && second.notion === "constant-percolation")
    return {
      ...base,
      notion: "constant-percolation",
      witness: {
        held: { ...first.witness.held, ...second.witness.held },
        fixed: { ...first.witness.fixed, ...second.witness.fixed },
      },
    };
  for (const notion of ["node-elimination", "constant-percolation"] as const)
    if (first.notion === notion || second.notion === notion)
      throw new EngineError("NOT_COMPOSABLE", `a ${notion} composes only with another ${notion}`);
  if (first.notion === "coarse-graining" || second.notion === "coarse-graining") {
    throw new EngineError("NOT_COMPOSABLE", "a coarse-graining composes only with another coarse-graining");
  }
  // Block emulation is a special dynamical embedding, so mixed pairs compose as embeddings.
  const e1 = encoder(first);
  const e2 = encoder(second);
  const map: Record<string, string> = {};
  for (const x of allStrings(second.target.nodes.length)) map[x] = e1(e2(x));
  return { ...base, notion: "dynamical-embedding", witness: { map } };
}

function composeBlocks(w1: BlockEmulationWitnessJson, w2: BlockEmulationWitnessJson): BlockEmulationWitnessJson {
  const inner = new Map(w1.blocks.map((b) => [b.target, b] as const));
  const blockOf = (g: string): CertificateBlock => {
    const b = inner.get(g);
    if (!b) throw new EngineError("BAD_CERTIFICATE", `intermediate node "${g}" has no block`);
    return b;
  };
  const blocks = w2.blocks.map((outer) => {
    const nodes: string[] = [];
    let zero = "";
    let one = "";
    outer.nodes.forEach((g, i) => {
      const b = blockOf(g);
      nodes.push(...b.nodes);
      zero += outer.zero[i] === "1" ? b.one : b.zero;
      one += outer.one[i] === "1" ? b.one : b.zero;
    });
    return { target: outer.target, nodes, zero, one };
  });
  // A Map, not assignment into an object, so that a node named "__proto__" is kept like any other.
  const context = new Map<string, 0 | 1>(Object.entries(w1.context));
  for (const [g, value] of Object.entries(w2.context)) {
    const b = blockOf(g);
    const word = value === 1 ? b.one : b.zero;
    b.nodes.forEach((name, i) => context.set(name, word[i] === "1" ? 1 : 0));
  }
  return { blocks, context: Object.fromEntries(context) };
}

function composeObservables(
  first: ReductionCertificate & { notion: "coarse-graining" },
  outer: CertificateObservable[],
): CertificateObservable[] {
  const sourceOrder = new Map(first.source.nodes.map((node, i) => [node.name, i] as const));
  const inner = new Map(first.witness.observables.map((o) => [o.target, o] as const));
  return outer.map((o) => {
    const used = o.inputs.map((g) => {
      const p = inner.get(g);
      if (!p) throw new EngineError("BAD_CERTIFICATE", `intermediate node "${g}" has no observable`);
      return p;
    });
    const inputs = [...new Set(used.flatMap((p) => p.inputs))].sort(
      (a, b) => sourceOrder.get(a)! - sourceOrder.get(b)!,
    );
    if (inputs.length > 20)
      throw new EngineError("TOO_LARGE", `the composed observable "${o.target}" reads more than 20 nodes`);
    let table = "";
    for (let row = 0; row < 2 ** inputs.length; row++) {
      const value = (name: string) => Math.floor(row / 2 ** inputs.indexOf(name)) % 2;
      let outerRow = 0;
      used.forEach((p, k) => {
        let r = 0;
        p.inputs.forEach((name, j) => (r += value(name) * 2 ** j));
        if (p.table[r] === "1") outerRow += 2 ** k;
      });
      table += o.table[outerRow] === "1" ? "1" : "0";
    }
    return { target: o.target, inputs, table };
  });
}
