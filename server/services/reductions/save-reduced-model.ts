// "Save as a new model" from a node-elimination run: the reduced network becomes a model of the project (revision 1),
// and a proposed reduction of the run's notion, with the run's certificate, links it to the source revision, so that
// once approved it joins the model hierarchy like any other reduction. The verifier runs first, off the request
// thread; the model, the reduction and the audit record are written in one transaction.
import type { Knex } from "knex";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import type { ReductionDetail } from "@shared/schemas/reductions";
import { NodeEliminationResult } from "@shared/schemas/run-tasks";
import { recordAudit } from "../../db/repositories/audit-log";
import { setTargetRevision } from "../../db/repositories/reductions";
import { getRun } from "../../db/repositories/runs";
import { HttpError } from "../../http/errors";
import { insertModelWithFirstRevision } from "../models/new-model";
import { checkCertificateOffThread } from "./check-certificate";
import { proposeReduction } from "./propose-reduction";
import { reductionOf, type ReductionActor } from "./review";

const CAUTION = "A reduction is a statement about the model, not about the cell it describes.";

function described(result: NodeEliminationResult, sourceName: string, sourceRevision: number): string {
  const what =
    result.mode === "percolate"
      ? `Percolation of constants${result.held.length ? ` with ${result.held.map((h) => `${h.node}=${h.value}`).join(", ")} held` : ""} ` +
        `fixed ${result.eliminated.length} nodes of ${sourceName} (revision ${sourceRevision}). It preserves all ` +
        "attractors (synchronous and asynchronous) and all fixed points, one to one."
      : `Node elimination removed ${result.eliminated.join(", ")} from ${sourceName} (revision ${sourceRevision}). ` +
        "It preserves the fixed points one to one; cycles and cyclic attractors are not preserved in general.";
  // The description field holds at most 2000 characters; long node lists are cut, the statement is kept whole.
  const tail = ` ${CAUTION}`;
  return what.length + tail.length <= 2000 ? what + tail : `${what.slice(0, 2000 - tail.length - 1)}…${tail}`;
}

export async function saveReducedModel(
  db: Knex,
  by: ReductionActor,
  body: { runId: string; name: string },
): Promise<{ reduction: ReductionDetail; modelId: string }> {
  const run = await getRun(db, body.runId, by.projectId);
  if (!run || run.kind !== "node-elimination")
    throw new HttpError(404, "NOT_FOUND", "runId: no node-elimination run with this id in this project", [
      { field: "body.runId", message: "no node-elimination run with this id in this project" },
    ]);
  if (run.state !== "succeeded" || !run.result || !run.model || !run.modelRevisionId)
    throw new HttpError(409, "CONFLICT", "This run has not succeeded, so there is no reduced model to save yet");
  const result = NodeEliminationResult.parse(run.result);
  if (!result.certificate)
    throw new HttpError(409, "CONFLICT", result.certificateNote ?? "This run has no reduced model to save");
  const certificate = result.certificate;
  const verification = await checkCertificateOffThread(certificate, null, " when the reduced model was saved");
  if (!verification.isValid)
    throw new HttpError(409, "INVALID_CERTIFICATE", `The run's certificate does not verify: ${verification.message}`);
  const sourceRevisionId = run.modelRevisionId;
  const source = run.model;
  const definition = readRuleText(result.ruleText);
  const network = compileDefinition(definition);
  const saved = await db.transaction(async (trx) => {
    const r = await proposeReduction(
      trx,
      {
        projectId: by.projectId,
        sourceRevisionId,
        targetRevisionId: null,
        certificate,
        flags: [],
        foundBy: by.user.id,
        foundInRunId: run.id,
      },
      () => verification,
    );
    if (!r.isNew) {
      const existing = await reductionOf(trx, by.projectId, r.id);
      if (existing.target)
        throw new HttpError(
          409,
          "ALREADY_SAVED",
          `This reduced model is already saved as "${existing.target.modelName}" (revision ${existing.target.revision})`,
        );
    }
    const { modelId, revisionId } = await insertModelWithFirstRevision(
      trx,
      { projectId: by.projectId, userId: by.user.id },
      {
        name: body.name,
        description: described(result, source.modelName, source.revision),
        model: { definition, network },
        ruleText: result.ruleText,
        source: "rules",
        message: `Reduced from ${source.modelName} (revision ${source.revision}) by run ${run.id}`,
      },
    );
    await setTargetRevision(trx, r.id, revisionId);
    await recordAudit(trx, {
      projectId: by.projectId,
      actorId: by.user.id,
      action: "reduction.save-reduced-model",
      target: r.id,
      details: { runId: run.id, modelId, name: body.name },
    });
    return { reductionId: r.id, modelId };
  });
  return { reduction: await reductionOf(db, by.projectId, saved.reductionId), modelId: saved.modelId };
}
