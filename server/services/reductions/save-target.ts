// A discovered target becomes a model of the project (revision 1 is the certificate's target network), and the
// reduction now points at it, so that once approved it joins the model hierarchy. The model is created the way
// every model is (server/services/models/new-model.ts), in the same transaction as the reduction's new target.
import type { Knex } from "knex";
import { networkFromCertificate } from "@shared/engine/certificates";
import { networkToDefinition, printRuleText } from "@shared/engine/rules";
import type { ReductionDetail } from "@shared/schemas/reductions";
import { recordAudit } from "../../db/repositories/audit-log";
import { setTargetRevision } from "../../db/repositories/reductions";
import { HttpError } from "../../http/errors";
import { insertModelWithFirstRevision } from "../models/new-model";
import { reductionOf, type ReductionActor } from "./review";

export async function saveTargetAsModel(
  db: Knex,
  by: ReductionActor,
  reductionId: string,
  name: string,
): Promise<ReductionDetail> {
  const r = await reductionOf(db, by.projectId, reductionId);
  if (r.target) throw new HttpError(409, "ALREADY_SAVED", `The target is already the model "${r.target.modelName}"`);
  const network = networkFromCertificate(r.certificate.target);
  const definition = networkToDefinition(network);
  await db.transaction(async (trx) => {
    const { modelId, revisionId } = await insertModelWithFirstRevision(
      trx,
      { projectId: by.projectId, userId: by.user.id },
      {
        name,
        description: `Target of a ${r.notion} found in ${r.source.modelName} (revision ${r.source.revision}).`,
        model: { definition, network },
        ruleText: printRuleText(definition),
        source: "rules",
        message: `Saved from reduction ${r.id}`,
      },
    );
    await setTargetRevision(trx, r.id, revisionId);
    await recordAudit(trx, {
      projectId: by.projectId,
      actorId: by.user.id,
      action: "reduction.save-target",
      target: r.id,
      details: { modelId, name },
    });
  });
  return reductionOf(db, by.projectId, r.id);
}
