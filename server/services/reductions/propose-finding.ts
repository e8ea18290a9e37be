// One click on a finding the search kept on its run but did not store: it enters review like any search result
// (verified first), and the run's result remembers the reduction so the finding shows as proposed.
import type { Knex } from "knex";
import { ReductionSearchParams, ReductionSearchResult, type ReductionDetail } from "@shared/schemas/reductions";
import { recordAudit } from "../../db/repositories/audit-log";
import { getRun, setRunResult } from "../../db/repositories/runs";
import { HttpError } from "../../http/errors";
import { checkCertificate } from "./check-certificate";
import { proposeReduction } from "./propose-reduction";
import { reductionOf, type ReductionActor } from "./review";
import { isSelfReduction } from "./statement-flags";

export async function proposeFinding(
  db: Knex,
  by: ReductionActor,
  ref: { runId: string; rank: number },
): Promise<{ reduction: ReductionDetail; isNew: boolean }> {
  const stored = await db.transaction(async (trx) => {
    const run = await getRun(trx, ref.runId, by.projectId);
    if (!run || run.kind !== "reduction-search")
      throw new HttpError(404, "NOT_FOUND", "runId: no reduction search with this id in this project", [
        { field: "body.runId", message: "no reduction search with this id in this project" },
      ]);
    if (run.state !== "succeeded" || !run.result)
      throw new HttpError(409, "CONFLICT", "This search has not finished, so it has no findings to propose yet");
    const params = ReductionSearchParams.parse(run.params);
    const result = ReductionSearchResult.parse(run.result);
    const index = result.findings.findIndex((f) => f.rank === ref.rank);
    const finding = result.findings[index];
    if (!finding)
      throw new HttpError(404, "NOT_FOUND", `rank: the search kept no finding ranked ${ref.rank + 1}`, [
        { field: "body.rank", message: "no such finding on this run" },
      ]);
    if (isSelfReduction(finding.certificate))
      throw new HttpError(
        400,
        "SELF_REDUCTION",
        "This finding reduces the model onto itself (F = G): it proves nothing",
      );
    const r = await proposeReduction(
      trx,
      {
        projectId: by.projectId,
        sourceRevisionId: params.sourceRevisionId,
        targetRevisionId: result.mode === "given-target" ? params.targetRevisionId : null,
        certificate: finding.certificate,
        flags: finding.flags,
        foundBy: by.user.id,
        foundInRunId: run.id,
        rank: finding.rank,
      },
      () => checkCertificate(finding.certificate, by.user),
    );
    const findings = result.findings.map((f, i) => (i === index ? { ...f, reductionId: r.id } : f));
    const reductionIds = result.reductionIds.includes(r.id) ? result.reductionIds : [...result.reductionIds, r.id];
    await setRunResult(trx, run.id, { ...result, findings, reductionIds });
    if (r.isNew)
      await recordAudit(trx, {
        projectId: by.projectId,
        actorId: by.user.id,
        action: "reduction.propose",
        target: r.id,
        details: { runId: run.id, rank: finding.rank },
      });
    return r;
  });
  return { reduction: await reductionOf(db, by.projectId, stored.id), isNew: stored.isNew };
}
