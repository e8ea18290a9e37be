// What a certificate says about itself before anyone reviews it: a reduction of a network onto the very same network
// (F = G) proves nothing and is refused, and one onto an isomorphic copy (same size, one step, each target node read
// from one source node) is only a renaming, so it is flagged and kept out of the review queue unless a person
// proposes it.
import type { Certificate } from "@shared/schemas/reductions";

type CertificateNetwork = Certificate["source"];

function networkKey(n: CertificateNetwork): string {
  return n.nodes
    .map((node) => `${node.name}(${node.inputs.join(",")})=${node.table}`)
    .sort()
    .join(";");
}

/** F = G: the same nodes with the same inputs and tables, in any order. */
export function isSelfReduction(c: Certificate): boolean {
  return c.source.nodes.length === c.target.nodes.length && networkKey(c.source) === networkKey(c.target);
}

/**
 * Block emulation at t = 1 with as many target nodes as source nodes uses one-node blocks (each target node has its
 * own block), so it is a renaming with value swaps; an embedding at t = 1 between equal state counts is a bijection
 * that commutes with the step, i.e. the same dynamics relabelled.
 */
export function isIsomorphicStatement(c: Certificate): boolean {
  if (c.time !== 1 || c.source.nodes.length !== c.target.nodes.length) return false;
  if (c.notion === "block-emulation") return c.witness.blocks.every((b) => b.nodes.length === 1);
  return c.notion === "dynamical-embedding";
}

/** The flags a stored statement carries: those of the search plus "isomorphic" when it is only a relabelling. */
export function statementFlags(c: Certificate, searchFlags: readonly string[]): string[] {
  const flags = [...searchFlags];
  if (isIsomorphicStatement(c) && !flags.includes("isomorphic")) flags.push("isomorphic");
  return flags;
}

/** A finding worth a reviewer's time carries no flag: constant, identity, decoupled, trivial or isomorphic. */
export function isWorthReview(flags: readonly string[]): boolean {
  return flags.length === 0;
}
