// Immutable revisions of a model (the table refuses updates): insert and read, never change.
import type { Knex } from "knex";
import { upgradeDefinition, type ModelDefinition } from "@shared/engine/rules";
import type { ModelSource, NetworkSummary, RevisionDetail, RevisionSummary } from "@shared/schemas/models";

interface RevisionRow {
  id: string;
  model_id: string;
  revision: number;
  definition: ModelDefinition;
  rule_text: string;
  network_summary: NetworkSummary;
  node_count: number;
  source: ModelSource;
  generator: Record<string, unknown> | null;
  message: string;
  created_by: string | null;
  created_by_name: string | null;
  created_at: Date;
  file_name: string | null;
  media_type: string | null;
  size_bytes: number | null;
}

export interface StoredRevision extends RevisionDetail {
  modelId: string;
  definition: ModelDefinition;
}

function toSummary(r: RevisionRow): RevisionSummary {
  return {
    id: r.id,
    revision: r.revision,
    nodeCount: r.node_count,
    source: r.source,
    message: r.message,
    createdBy: r.created_by ? { id: r.created_by, displayName: r.created_by_name ?? "" } : null,
    createdAt: r.created_at.toISOString(),
    file: r.file_name ? { fileName: r.file_name, mediaType: r.media_type ?? "", sizeBytes: r.size_bytes ?? 0 } : null,
  };
}

function baseQuery(db: Knex) {
  return db("model_revisions as r")
    .leftJoin("users as u", "u.id", "r.created_by")
    .leftJoin("model_files as f", "f.revision_id", "r.id")
    .select("r.*", "u.display_name as created_by_name", "f.file_name", "f.media_type", "f.size_bytes");
}

export async function listRevisions(db: Knex, modelId: string): Promise<RevisionSummary[]> {
  const rows = (await baseQuery(db).where("r.model_id", modelId).orderBy("r.revision", "desc")) as RevisionRow[];
  return rows.map(toSummary);
}

export async function findRevision(db: Knex, modelId: string, revision: number): Promise<StoredRevision | null> {
  const r = (await baseQuery(db).where({ "r.model_id": modelId, "r.revision": revision }).first()) as
    RevisionRow | undefined;
  if (!r) return null;
  return {
    ...toSummary(r),
    modelId: r.model_id,
    // Revisions written before operator chains were stored flat hold binary nodes; read both forms.
    definition: upgradeDefinition(r.definition),
    ruleText: r.rule_text,
    network: r.network_summary,
    generator: r.generator,
  };
}

export interface NewRevision {
  modelId: string;
  revision: number;
  definition: ModelDefinition;
  ruleText: string;
  network: NetworkSummary;
  source: ModelSource;
  generator?: Record<string, unknown> | null;
  message?: string;
  createdBy: string;
}

export async function insertRevision(trx: Knex, input: NewRevision): Promise<string> {
  const [row] = await trx("model_revisions")
    .insert({
      model_id: input.modelId,
      revision: input.revision,
      definition: JSON.stringify(input.definition),
      rule_text: input.ruleText,
      network_summary: JSON.stringify(input.network),
      node_count: input.network.nodes.length,
      source: input.source,
      generator: input.generator ? JSON.stringify(input.generator) : null,
      message: input.message ?? "",
      created_by: input.createdBy,
    })
    .returning("id");
  return (row as { id: string }).id;
}

/** A cached analysis result of one revision, or null. */
export async function findAnalysis<T>(
  db: Knex,
  revisionId: string,
  kind: "synchronous",
  paramsKey = "",
): Promise<T | null> {
  const row = (await db("model_analyses")
    .where({ revision_id: revisionId, kind, params_key: paramsKey })
    .first("result")) as { result: T } | undefined;
  return row ? row.result : null;
}

export async function storeAnalysis(
  db: Knex,
  revisionId: string,
  kind: "synchronous",
  result: unknown,
  paramsKey = "",
): Promise<void> {
  await db("model_analyses")
    .insert({ revision_id: revisionId, kind, params_key: paramsKey, result: JSON.stringify(result) })
    .onConflict(["revision_id", "kind", "params_key"])
    .ignore();
}

/** The result of the newest succeeded "attractors" run of a revision (the runs feature computes large ones). */
export async function findAttractorRunResult(db: Knex, revisionId: string): Promise<unknown | null> {
  const row = (await db("runs")
    .where({ model_revision_id: revisionId, kind: "attractors", state: "succeeded" })
    .orderBy("finished_at", "desc")
    .first("result")) as { result: unknown } | undefined;
  return row?.result ?? null;
}
