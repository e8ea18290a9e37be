// Creating a model: its row, revision 1 (with the uploaded file, if any) and the audit entry, in one transaction, so a
// model never exists without its first revision and the log never names a model that was rolled back. The input is
// read and checked completely before the transaction opens, so a parse error stores nothing. The API and the demo
// seed both create models here.
import type { Knex } from "knex";
import { printRuleText } from "@shared/engine/rules";
import type { GeneratorParams, ModelDetail, ModelSource } from "@shared/schemas/models";
import { recordAudit } from "../../db/repositories/audit-log";
import { insertModelFile, type ModelFile } from "../../db/repositories/model-files";
import { insertRevision } from "../../db/repositories/model-revisions";
import { insertModel } from "../../db/repositories/models";
import { generatedModel } from "./generated-model";
import type { ModelAuthor } from "./model-author";
import { modelDetail } from "./model-detail";
import { INLINE_INPUT_CHARS, inPlaceIfSmall } from "../../workers/interactive-pool";
import type { ReadModel } from "./model-reading";
import { networkSummary } from "./network-summary";

export interface FirstRevision {
  /** A fixed id (the demo seed); otherwise the database chooses one. */
  id?: string;
  name: string;
  description: string;
  model: ReadModel;
  ruleText: string;
  source: ModelSource;
  generator?: Record<string, unknown>;
  file?: ModelFile;
  message?: string;
}

/** The model row and its revision 1, inside the caller's transaction (which also writes the audit entry). */
export async function insertModelWithFirstRevision(
  trx: Knex,
  author: ModelAuthor,
  input: FirstRevision,
): Promise<{ modelId: string; revisionId: string }> {
  const modelId = await insertModel(trx, {
    id: input.id,
    projectId: author.projectId,
    name: input.name,
    description: input.description,
    createdBy: author.userId,
  });
  const revisionId = await insertRevision(trx, {
    modelId,
    revision: 1,
    definition: input.model.definition,
    ruleText: input.ruleText,
    network: networkSummary(input.model.definition, input.model.network),
    source: input.source,
    generator: input.generator ?? null,
    message: input.message ?? "",
    createdBy: author.userId,
  });
  if (input.file) await insertModelFile(trx, revisionId, input.file);
  return { modelId, revisionId };
}

type CreateAction = "model.create" | "model.import" | "model.generate";

async function createModel(
  db: Knex,
  author: ModelAuthor,
  input: FirstRevision,
  action: CreateAction,
): Promise<ModelDetail> {
  const modelId = await db.transaction(async (trx) => {
    const { modelId } = await insertModelWithFirstRevision(trx, author, input);
    await recordAudit(trx, {
      projectId: author.projectId,
      actorId: author.userId,
      action,
      target: modelId,
      details: {
        name: input.name,
        source: input.source,
        nodeCount: input.model.network.names.length,
        ...(input.file ? { fileName: input.file.fileName } : {}),
      },
    });
    return modelId;
  });
  return modelDetail(db, author.projectId, modelId, 1);
}

export async function createModelFromRules(
  db: Knex,
  author: ModelAuthor,
  input: { id?: string; name: string; description: string; ruleText: string },
): Promise<ModelDetail> {
  const model = await inPlaceIfSmall(input.ruleText.length <= INLINE_INPUT_CHARS, "readRules", input.ruleText);
  return createModel(db, author, { ...input, model, source: "rules" }, "model.create");
}

export function generateModel(
  db: Knex,
  author: ModelAuthor,
  input: { id?: string; name: string; description: string; generator: GeneratorParams },
): Promise<ModelDetail> {
  const model = generatedModel(input.generator);
  return createModel(
    db,
    author,
    {
      ...input,
      model,
      ruleText: printRuleText(model.definition),
      source: "generator",
      generator: input.generator,
    },
    "model.generate",
  );
}

export interface UploadedFile {
  /** The name the browser sent. */
  originalName: string;
  mediaType: string;
  bytes: Buffer;
}

/** A model read from an uploaded file, which is kept byte for byte beside revision 1. */
export async function importModel(
  db: Knex,
  author: ModelAuthor,
  upload: UploadedFile,
  fields: { name?: string; description: string },
): Promise<ModelDetail> {
  const fileName = upload.originalName.normalize("NFC").slice(-255);
  const { suggestedName, ...read } = await inPlaceIfSmall(
    upload.bytes.length <= INLINE_INPUT_CHARS,
    "readUpload",
    fileName,
    upload.bytes,
  );
  const name = fields.name ?? suggestedName ?? (fileName.replace(/\.[^.]+$/, "").trim() || "Imported model");
  return createModel(
    db,
    author,
    {
      name: name.slice(0, 120),
      description: fields.description,
      model: { definition: read.definition, network: read.network },
      ruleText: read.ruleText,
      source: read.source,
      file: {
        fileName,
        mediaType: upload.mediaType || "application/octet-stream",
        bytes: upload.bytes,
        sizeBytes: upload.bytes.length,
      },
    },
    "model.import",
  );
}
