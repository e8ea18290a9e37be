// A new revision of a model from edited rule text. Revisions are immutable and numbered without gaps: the model row
// is locked while the next number is taken, so two concurrent edits get consecutive numbers.
import type { Knex } from "knex";
import type { ModelDetail } from "@shared/schemas/models";
import { recordAudit } from "../../db/repositories/audit-log";
import { insertRevision } from "../../db/repositories/model-revisions";
import { lockNextRevision, setLatestRevision } from "../../db/repositories/models";
import { HttpError } from "../../http/errors";
import type { ModelAuthor } from "./model-author";
import { modelDetail } from "./model-detail";
import { INLINE_INPUT_CHARS, inPlaceIfSmall } from "../../workers/interactive-pool";
import { networkSummary } from "./network-summary";

export async function reviseModel(
  db: Knex,
  author: ModelAuthor,
  modelId: string,
  input: { ruleText: string; message: string },
): Promise<ModelDetail> {
  const model = await inPlaceIfSmall(input.ruleText.length <= INLINE_INPUT_CHARS, "readRules", input.ruleText);
  const revision = await db.transaction(async (trx) => {
    const next = await lockNextRevision(trx, author.projectId, modelId);
    if (next === null) throw new HttpError(404, "NOT_FOUND", "No such model in this project");
    await insertRevision(trx, {
      modelId,
      revision: next,
      definition: model.definition,
      ruleText: input.ruleText,
      network: networkSummary(model.definition, model.network),
      source: "edit",
      message: input.message,
      createdBy: author.userId,
    });
    await setLatestRevision(trx, modelId, next);
    await recordAudit(trx, {
      projectId: author.projectId,
      actorId: author.userId,
      action: "model.revise",
      target: modelId,
      details: { revision: next, nodeCount: model.network.names.length },
    });
    return next;
  });
  return modelDetail(db, author.projectId, modelId, revision);
}
