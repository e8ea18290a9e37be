// A finished search's findings: the full ranked list stays on the run's result, and only the findings worth a
// reviewer's time become proposed reductions (each statement stored once, whoever finds it again). They are written
// in the transaction that marks the run succeeded, so a run never succeeds with its reductions missing.
import type { Knex } from "knex";
import { ReductionSearchParams, ReductionSearchResult } from "@shared/schemas/reductions";
import { recordAudit } from "../../db/repositories/audit-log";
import { checkCertificate } from "./check-certificate";
import { proposeReduction } from "./propose-reduction";
import { isSelfReduction, isWorthReview } from "./statement-flags";

/** At most this many findings of one search enter review by themselves; the others wait on the run for a person. */
export const MAX_PROPOSED_PER_SEARCH = 10;

export interface FinishedRun {
  id: string;
  projectId: string;
  startedBy: string | null;
}

export async function storeSearchFindings(
  trx: Knex,
  run: FinishedRun,
  rawResult: unknown,
  rawParams: unknown,
): Promise<unknown> {
  const params = ReductionSearchParams.parse(rawParams);
  const result = ReductionSearchResult.parse(rawResult);
  const ids: string[] = [];
  let flagged = 0;
  let beyondLimit = 0;
  const findings = [];
  for (const f of result.findings) {
    if (isSelfReduction(f.certificate) || !isWorthReview(f.flags)) {
      flagged++;
      findings.push(f);
      continue;
    }
    if (ids.length >= MAX_PROPOSED_PER_SEARCH) {
      beyondLimit++;
      findings.push(f);
      continue;
    }
    const stored = await proposeReduction(
      trx,
      {
        projectId: run.projectId,
        sourceRevisionId: params.sourceRevisionId,
        // Only a given-target search proves something about a stored target model.
        targetRevisionId: result.mode === "given-target" ? params.targetRevisionId : null,
        certificate: f.certificate,
        flags: f.flags,
        foundBy: run.startedBy,
        foundInRunId: run.id,
        rank: f.rank,
      },
      // The independent verifier re-checks every finding before anyone sees it, so a search bug cannot vouch for itself.
      () => checkCertificate(f.certificate, null, " when found"),
    );
    ids.push(stored.id);
    findings.push({ ...f, reductionId: stored.id });
  }
  if (ids.length) {
    await recordAudit(trx, {
      projectId: run.projectId,
      actorId: run.startedBy,
      action: "reduction.found",
      target: run.id,
      details: { count: ids.length, mode: result.mode },
    });
  }
  return {
    ...result,
    findings,
    reductionIds: ids,
    heldBack: { notListed: Math.max(0, result.distinctTargets - result.findings.length), flagged, beyondLimit },
  };
}
