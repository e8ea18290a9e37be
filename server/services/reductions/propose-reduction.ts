// A proven statement enters review as a proposed reduction, stored once however often it is found (by a search, an
// upload or the demo seed), with the independent verifier's record of it. Runs inside the caller's transaction.
import type { Knex } from "knex";
import type { Certificate, Verification } from "@shared/schemas/reductions";
import { insertReduction, setVerification } from "../../db/repositories/reductions";
import { statementKey } from "./statement-key";

export interface Proposal {
  projectId: string;
  sourceRevisionId: string;
  /** The stored target model's revision, when the statement is about one (given-target searches, uploads). */
  targetRevisionId: string | null;
  certificate: Certificate;
  flags: string[];
  foundBy: string | null;
  foundInRunId: string | null;
  /** Position in the search's ranking (0 = best). */
  rank?: number;
}

/** `verify` is asked only for a new statement: one already stored keeps its verification history. */
export async function proposeReduction(
  trx: Knex,
  p: Proposal,
  verify: () => Verification,
): Promise<{ id: string; isNew: boolean }> {
  const stored = await insertReduction(trx, {
    ...p,
    notion: p.certificate.notion,
    timeScale: p.certificate.time,
    targetKey: statementKey(p.certificate, p.targetRevisionId),
  });
  if (stored.isNew) await setVerification(trx, stored.id, verify());
  return stored;
}
