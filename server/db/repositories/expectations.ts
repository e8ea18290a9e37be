// A model's expectations and the results of checking revisions against them. Expectation rows change (edits,
// imports); result rows are only added, each naming the body hash it checked.
import type { Knex } from "knex";
import type { Expectation } from "@shared/engine/expectations";
import type { MatrixCell, StoredExpectation } from "@shared/schemas/expectations";

interface ExpectationRow {
  id: string;
  model_id: string;
  key: string;
  body: Pick<Expectation, "update" | "condition" | "outcome">;
  body_hash: string;
  source: string;
  note: string;
  created_by: string | null;
  created_by_name: string | null;
  created_at: Date;
  updated_at: Date;
}

function toStored(r: ExpectationRow): StoredExpectation {
  return {
    id: r.id,
    modelId: r.model_id,
    expectation: { id: r.key, ...r.body, source: r.source, note: r.note },
    bodyHash: r.body_hash,
    createdBy: r.created_by ? { id: r.created_by, displayName: r.created_by_name ?? "" } : null,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
  };
}

function baseQuery(db: Knex) {
  return db("expectations as e")
    .leftJoin("users as u", "u.id", "e.created_by")
    .select("e.*", "u.display_name as created_by_name");
}

export async function listExpectations(db: Knex, modelId: string): Promise<StoredExpectation[]> {
  const rows = (await baseQuery(db)
    .where("e.model_id", modelId)
    .orderBy([{ column: "e.created_at" }, { column: "e.key" }])) as ExpectationRow[];
  return rows.map(toStored);
}

export async function findExpectation(db: Knex, modelId: string, id: string): Promise<StoredExpectation | null> {
  const row = (await baseQuery(db).where({ "e.model_id": modelId, "e.id": id }).first()) as ExpectationRow | undefined;
  return row ? toStored(row) : null;
}

export interface ExpectationWrite {
  expectation: Expectation;
  bodyHash: string;
}

function columns(w: ExpectationWrite) {
  const { id, update, condition, outcome, source, note } = w.expectation;
  return { key: id, body: JSON.stringify({ update, condition, outcome }), body_hash: w.bodyHash, source, note };
}

export async function insertExpectation(
  db: Knex,
  modelId: string,
  createdBy: string | null,
  w: ExpectationWrite,
): Promise<string> {
  const [row] = await db("expectations")
    .insert({ model_id: modelId, created_by: createdBy, ...columns(w) })
    .returning("id");
  return (row as { id: string }).id;
}

export async function updateExpectation(db: Knex, modelId: string, id: string, w: ExpectationWrite): Promise<boolean> {
  const n = await db("expectations")
    .where({ model_id: modelId, id })
    .update({ ...columns(w), updated_at: db.fn.now() });
  return n > 0;
}

export async function deleteExpectation(db: Knex, modelId: string, id: string): Promise<boolean> {
  return (await db("expectations").where({ model_id: modelId, id }).delete()) > 0;
}

export async function deleteExpectationsExcept(db: Knex, modelId: string, keys: string[]): Promise<number> {
  return db("expectations").where({ model_id: modelId }).whereNotIn("key", keys).delete();
}

export interface NewResult {
  expectationId: string;
  revisionId: string;
  runId: string | null;
  bodyHash: string;
  status: "pass" | "fail" | "undecided";
  method: string;
  detail: string;
  reason: string | null;
  broke: boolean;
}

export async function insertResults(db: Knex, results: NewResult[]): Promise<void> {
  if (results.length === 0) return;
  await db("expectation_results").insert(
    results.map((r) => ({
      expectation_id: r.expectationId,
      revision_id: r.revisionId,
      run_id: r.runId,
      body_hash: r.bodyHash,
      status: r.status,
      method: r.method,
      detail: r.detail,
      reason: r.reason,
      broke: r.broke,
    })),
  );
}

/**
 * The newest result of each (expectation, revision) of a model that was about the expectation's current body,
 * with the revision's number.
 */
export async function currentResults(db: Knex, modelId: string): Promise<(MatrixCell & { revisionId: string })[]> {
  const rows = (await db
    .select(db.raw("distinct on (res.expectation_id, res.revision_id) res.*, r.revision as revision_number"))
    .from("expectation_results as res")
    .join("expectations as e", function () {
      this.on("e.id", "=", "res.expectation_id").andOn("e.body_hash", "=", "res.body_hash");
    })
    .join("model_revisions as r", "r.id", "res.revision_id")
    .where("e.model_id", modelId)
    .orderBy([
      { column: "res.expectation_id" },
      { column: "res.revision_id" },
      { column: "res.checked_at", order: "desc" },
    ])) as {
    expectation_id: string;
    revision_id: string;
    revision_number: number;
    status: "pass" | "fail" | "undecided";
    method: string;
    detail: string;
    reason: string | null;
    broke: boolean;
    run_id: string | null;
    checked_at: Date;
  }[];
  return rows.map((r) => ({
    expectationId: r.expectation_id,
    revisionId: r.revision_id,
    revision: r.revision_number,
    status: r.status,
    method: r.method,
    detail: r.detail,
    reason: r.reason,
    broke: r.broke,
    runId: r.run_id,
    checkedAt: r.checked_at.toISOString(),
  }));
}
