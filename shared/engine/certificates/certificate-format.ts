// Self-contained reduction certificates (format version 1, documented in docs/certificates.md): both networks as
// named truth tables plus the witness of one notion, so anyone can re-check a reduction by plain simulation.
// The notions are those of Ollinger (TCS, 2003) for block emulation and Israeli & Goldenfeld (PRE, 2006) for coarse-graining.
import { EngineError } from "../errors";
import { checkNetwork, stateToString, type BooleanNetwork } from "../network";
import { planCone } from "./cone-check";
import { MAX_VERIFIED_SOURCE_NODES } from "./verify-certificate";

export const CERTIFICATE_FORMAT = "emulant-reduction";
export const CERTIFICATE_VERSION = 1;

export type ReductionNotion =
  "block-emulation" | "dynamical-embedding" | "coarse-graining" | "node-elimination" | "constant-percolation";

export interface CertificateNode {
  readonly name: string;
  readonly inputs: string[];
  /** Character r is the node's next value for row r; bit j of r is the value of inputs[j]. */
  readonly table: string;
}

export interface CertificateNetwork {
  readonly nodes: CertificateNode[];
}

export interface CertificateBlock {
  readonly target: string;
  readonly nodes: string[];
  readonly zero: string;
  readonly one: string;
}

export interface BlockEmulationWitnessJson {
  readonly blocks: CertificateBlock[];
  readonly context: Record<string, 0 | 1>;
}

export interface EmbeddingWitnessJson {
  /** Target state (0/1 string in target node order) -> source state (0/1 string in source node order). */
  readonly map: Record<string, string>;
}

export interface CertificateObservable {
  readonly target: string;
  readonly inputs: string[];
  readonly table: string;
}

/** What the verifier reads to check one target node of a coarse-graining of a large source (docs/certificates.md). */
export interface CertificateCone {
  readonly target: string;
  readonly support: string[];
  readonly method: "table" | "sat";
}

export interface CoarseGrainingWitnessJson {
  readonly observables: CertificateObservable[];
  /** Stated for sources above 22 nodes, whose certificates are checked cone by cone. */
  readonly cones?: CertificateCone[];
}

export interface NodeEliminationWitnessJson {
  /** Source nodes in the order they were substituted away. */
  readonly eliminated: string[];
}

export interface PercolationWitnessJson {
  /** Source nodes held at a value by the caller (their rules replaced by the constant). */
  readonly held: Record<string, 0 | 1>;
  /** Every removed node with its forced value, held ones included. */
  readonly fixed: Record<string, 0 | 1>;
}

interface CertificateBase {
  readonly format: typeof CERTIFICATE_FORMAT;
  readonly version: typeof CERTIFICATE_VERSION;
  readonly time: number;
  readonly source: CertificateNetwork;
  readonly target: CertificateNetwork;
}

export type ReductionCertificate =
  | (CertificateBase & { readonly notion: "block-emulation"; readonly witness: BlockEmulationWitnessJson })
  | (CertificateBase & { readonly notion: "dynamical-embedding"; readonly witness: EmbeddingWitnessJson })
  | (CertificateBase & { readonly notion: "coarse-graining"; readonly witness: CoarseGrainingWitnessJson })
  | (CertificateBase & { readonly notion: "node-elimination"; readonly witness: NodeEliminationWitnessJson })
  | (CertificateBase & { readonly notion: "constant-percolation"; readonly witness: PercolationWitnessJson });

export function networkToCertificate(net: BooleanNetwork): CertificateNetwork {
  return {
    nodes: net.names.map((name, i) => ({
      name,
      inputs: Array.from(net.regulators[i]!, (r) => net.names[r]!),
      table: Array.from(net.tables[i]!, (b) => (b ? "1" : "0")).join(""),
    })),
  };
}

export function networkFromCertificate(cn: CertificateNetwork): BooleanNetwork {
  const index = new Map(cn.nodes.map((node, i) => [node.name, i] as const));
  return checkNetwork({
    names: cn.nodes.map((node) => node.name),
    regulators: cn.nodes.map((node) =>
      Int32Array.from(node.inputs, (name) => {
        const i = index.get(name);
        if (i === undefined)
          throw new EngineError("BAD_CERTIFICATE", `node "${node.name}" reads unknown node "${name}"`);
        return i;
      }),
    ),
    tables: cn.nodes.map((node) => Uint8Array.from(node.table, (c) => (c === "1" ? 1 : 0))),
  });
}

/** Certificate for a block emulation witness given with source node indices (as the searches return it). */
export function blockEmulationCertificate(
  source: BooleanNetwork,
  target: BooleanNetwork,
  witness: {
    readonly time: number;
    readonly blocks: readonly {
      readonly nodes: readonly number[];
      readonly zero: readonly number[];
      readonly one: readonly number[];
    }[];
    readonly context: readonly number[];
  },
): ReductionCertificate {
  // fromEntries makes own properties even for a node named "__proto__", which plain assignment would not.
  const context: Record<string, 0 | 1> = Object.fromEntries(
    witness.context.flatMap((value, v) => (value === -1 ? [] : [[source.names[v]!, value ? 1 : 0] as const])),
  );
  return {
    format: CERTIFICATE_FORMAT,
    version: CERTIFICATE_VERSION,
    notion: "block-emulation",
    time: witness.time,
    source: networkToCertificate(source),
    target: networkToCertificate(target),
    witness: {
      blocks: witness.blocks.map((b, j) => ({
        target: target.names[j]!,
        nodes: b.nodes.map((v) => source.names[v]!),
        zero: b.zero.join(""),
        one: b.one.join(""),
      })),
      context,
    },
  };
}

/** Certificate for a dynamical embedding given as map[targetState] = sourceState. */
export function embeddingCertificate(
  source: BooleanNetwork,
  target: BooleanNetwork,
  time: number,
  map: ArrayLike<number>,
): ReductionCertificate {
  const m = target.names.length;
  const n = source.names.length;
  const json: Record<string, string> = {};
  for (let x = 0; x < map.length; x++) json[stateToString(x, m)] = stateToString(map[x]!, n);
  return {
    format: CERTIFICATE_FORMAT,
    version: CERTIFICATE_VERSION,
    notion: "dynamical-embedding",
    time,
    source: networkToCertificate(source),
    target: networkToCertificate(target),
    witness: { map: json },
  };
}

/**
 * Certificate for a coarse-graining: observable k defines target node k. Above MAX_VERIFIED_SOURCE_NODES source
 * nodes it states the cone each target node is checked on, so the JSON says what its check reads.
 */
export function coarseGrainingCertificate(
  source: BooleanNetwork,
  target: BooleanNetwork,
  time: number,
  observables: readonly { readonly inputs: readonly number[]; readonly table: ArrayLike<number> }[],
): ReductionCertificate {
  const obs = observables.map((o) => ({ inputs: [...o.inputs], table: Uint8Array.from(o.table) }));
  const wordNet = (net: BooleanNetwork) => ({
    names: net.names,
    inputs: net.regulators.map((r) => Array.from(r)),
    tables: net.tables,
  });
  const cones =
    source.names.length > MAX_VERIFIED_SOURCE_NODES
      ? target.names.map((name, j) => {
          const plan = planCone(wordNet(source), wordNet(target), obs, j, time);
          return { target: name, support: plan.support.map((v) => source.names[v]!), method: plan.method };
        })
      : null;
  return {
    format: CERTIFICATE_FORMAT,
    version: CERTIFICATE_VERSION,
    notion: "coarse-graining",
    time,
    source: networkToCertificate(source),
    target: networkToCertificate(target),
    witness: {
      observables: observables.map((o, k) => ({
        target: target.names[k]!,
        inputs: o.inputs.map((v) => source.names[v]!),
        table: Array.from(o.table, (b) => (b ? "1" : "0")).join(""),
      })),
      ...(cones ? { cones } : {}),
    },
  };
}

/**
 * Certificate for node elimination: the reduced network's functions are those of the source with the eliminated
 * nodes substituted in the order listed. The statement is about fixed points, so the time scale is 1.
 */
export function eliminationCertificate(
  source: BooleanNetwork,
  target: BooleanNetwork,
  eliminated: readonly string[],
): ReductionCertificate {
  return {
    format: CERTIFICATE_FORMAT,
    version: CERTIFICATE_VERSION,
    notion: "node-elimination",
    time: 1,
    source: networkToCertificate(source),
    target: networkToCertificate(target),
    witness: { eliminated: [...eliminated] },
  };
}

/** Certificate for the percolation of constants, with the nodes the caller held and every node fixed. */
export function percolationCertificate(
  source: BooleanNetwork,
  target: BooleanNetwork,
  held: Record<string, 0 | 1>,
  fixed: Record<string, 0 | 1>,
): ReductionCertificate {
  return {
    format: CERTIFICATE_FORMAT,
    version: CERTIFICATE_VERSION,
    notion: "constant-percolation",
    time: 1,
    source: networkToCertificate(source),
    target: networkToCertificate(target),
    witness: { held: { ...held }, fixed: { ...fixed } },
  };
}
