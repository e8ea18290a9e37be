// Models of a project: a named line of revisions. Writes happen inside the caller's transaction together with the
// revision they create, so a model never exists without its first revision.
import type { Knex } from "knex";
import type { ModelSource, ModelSummary } from "@shared/schemas/models";

interface ModelRow {
  id: string;
  project_id: string;
  name: string;
  description: string;
  latest_revision: number;
  created_by: string | null;
  created_by_name: string | null;
  updated_by: string | null;
  updated_by_name: string | null;
  node_count: number;
  source: ModelSource;
  created_at: Date;
  updated_at: Date;
}

function toSummary(r: ModelRow): ModelSummary {
  return {
    id: r.id,
    projectId: r.project_id,
    name: r.name,
    description: r.description,
    nodeCount: r.node_count,
    latestRevision: r.latest_revision,
    source: r.source,
    createdBy: r.created_by ? { id: r.created_by, displayName: r.created_by_name ?? "" } : null,
    updatedBy: r.updated_by ? { id: r.updated_by, displayName: r.updated_by_name ?? "" } : null,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
  };
}

function summaryQuery(db: Knex) {
  return db("models as m")
    .join("model_revisions as r", function () {
      this.on("r.model_id", "=", "m.id").andOn("r.revision", "=", "m.latest_revision");
    })
    .leftJoin("users as cu", "cu.id", "m.created_by")
    .leftJoin("users as uu", "uu.id", "r.created_by")
    .select(
      "m.id",
      "m.project_id",
      "m.name",
      "m.description",
      "m.latest_revision",
      "m.created_by",
      "m.created_at",
      "m.updated_at",
      "cu.display_name as created_by_name",
      "r.created_by as updated_by",
      "uu.display_name as updated_by_name",
      "r.node_count",
      "r.source",
    );
}

export async function listModels(db: Knex, projectId: string): Promise<ModelSummary[]> {
  const rows = (await summaryQuery(db)
    .where("m.project_id", projectId)
    .orderBy([{ column: "m.updated_at", order: "desc" }, { column: "m.name" }])) as ModelRow[];
  return rows.map(toSummary);
}

export async function findModel(db: Knex, projectId: string, modelId: string): Promise<ModelSummary | null> {
  const row = (await summaryQuery(db).where({ "m.project_id": projectId, "m.id": modelId }).first()) as
    ModelRow | undefined;
  return row ? toSummary(row) : null;
}

export async function insertModel(
  trx: Knex,
  input: { id?: string; projectId: string; name: string; description: string; createdBy: string },
): Promise<string> {
  const [row] = await trx("models")
    .insert({
      // The demo seed gives its models fixed ids; everything else lets the database choose.
      ...(input.id ? { id: input.id } : {}),
      project_id: input.projectId,
      name: input.name,
      description: input.description,
      created_by: input.createdBy,
      latest_revision: 1,
    })
    .returning("id");
  return (row as { id: string }).id;
}

/** Locks the model row so two concurrent edits get consecutive revision numbers; returns the next number. */
export async function lockNextRevision(trx: Knex, projectId: string, modelId: string): Promise<number | null> {
  const row = (await trx("models")
    .where({ id: modelId, project_id: projectId })
    .forUpdate()
    .first("latest_revision")) as { latest_revision: number } | undefined;
  return row ? row.latest_revision + 1 : null;
}

export async function setLatestRevision(trx: Knex, modelId: string, revision: number): Promise<void> {
  await trx("models").where({ id: modelId }).update({ latest_revision: revision, updated_at: trx.fn.now() });
}
