// Reading a project's models by id: a model with one of its revisions, or the stored revision an analysis runs on.
// A model of another project is as missing as one that does not exist (404 either way).
import type { Knex } from "knex";
import type { ModelDetail, RevisionSummary } from "@shared/schemas/models";
import { findRevision, listRevisions, type StoredRevision } from "../../db/repositories/model-revisions";
import { findModel } from "../../db/repositories/models";
import { HttpError } from "../../http/errors";

const noSuchModel = () => new HttpError(404, "NOT_FOUND", "No such model in this project");

/** The model with the given revision, or with its latest one. */
export async function modelDetail(
  db: Knex,
  projectId: string,
  modelId: string,
  revision?: number,
): Promise<ModelDetail> {
  const { model, stored } = await storedRevision(db, projectId, modelId, revision);
  const { modelId: _m, definition: _d, ...rev } = stored;
  return { model, revision: rev };
}

/** A revision with its definition, for the analyses and exports; the latest one when no number is given. */
export async function storedRevision(db: Knex, projectId: string, modelId: string, revision?: number) {
  const model = await findModel(db, projectId, modelId);
  if (!model) throw noSuchModel();
  const stored: StoredRevision | null = await findRevision(db, model.id, revision ?? model.latestRevision);
  if (!stored) throw new HttpError(404, "NOT_FOUND", `Model ${model.name} has no revision ${revision}`);
  return { model, stored };
}

export async function modelRevisions(db: Knex, projectId: string, modelId: string): Promise<RevisionSummary[]> {
  const model = await findModel(db, projectId, modelId);
  if (!model) throw noSuchModel();
  return listRevisions(db, model.id);
}
