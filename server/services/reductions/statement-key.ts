// Two searches that prove the same statement (same source revision, notion, time scale and target dynamics) must
// store one reduction: the key names the target by its stored revision when it has one, else by a digest of its
// network. The digest is taken over the network written field by field in a fixed order, so it does not depend on
// the key order of the object it was given (uploaded JSON, a search result read back from jsonb).
import { createHash } from "node:crypto";
import type { Certificate } from "@shared/schemas/reductions";

export function statementKey(certificate: Certificate, targetRevisionId: string | null): string {
  if (targetRevisionId) return `revision:${targetRevisionId}`;
  const network = {
    nodes: certificate.target.nodes.map((n) => ({ name: n.name, inputs: n.inputs, table: n.table })),
  };
  return "network:" + createHash("sha256").update(JSON.stringify(network)).digest("hex");
}
