// The compiled network of a project's model at its latest revision: what searches run on and what an uploaded
// certificate's source must equal.
import type { Knex } from "knex";
import type { BooleanNetwork } from "@shared/engine/network";
import { compileDefinition } from "@shared/engine/rules";
import { findRevision } from "../../db/repositories/model-revisions";
import { findModel } from "../../db/repositories/models";
import { HttpError } from "../../http/errors";

export interface RevisionNetwork {
  modelId: string;
  modelName: string;
  revisionId: string;
  revision: number;
  network: BooleanNetwork;
}

export async function latestRevisionNetwork(
  db: Knex,
  projectId: string,
  modelId: string,
  field = "modelId",
): Promise<RevisionNetwork> {
  const model = await findModel(db, projectId, modelId);
  if (!model) throw new HttpError(404, "NOT_FOUND", `${field}: no such model in this project`, { field });
  const revision = await findRevision(db, modelId, model.latestRevision);
  if (!revision)
    throw new HttpError(404, "NOT_FOUND", `${field}: the model has no revision ${model.latestRevision}`, { field });
  return {
    modelId,
    modelName: model.name,
    revisionId: revision.id,
    revision: revision.revision,
    network: compileDefinition(revision.definition),
  };
}
