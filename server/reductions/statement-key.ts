// Two searches that prove the same statement (same source revision, notion, time scale and target dynamics) must
// store one reduction: the key names the target by its stored revision when it has one, else by a digest of its network.
import { createHash } from "node:crypto";
import type { Certificate } from "@shared/schemas/reductions";

export function statementKey(certificate: Certificate, targetRevisionId: string | null): string {
  if (targetRevisionId) return `revision:${targetRevisionId}`;
  return "network:" + createHash("sha256").update(JSON.stringify(certificate.target)).digest("hex");
}
