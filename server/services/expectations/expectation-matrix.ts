// The expectation-by-revision matrix of a model: every expectation against every revision, each cell the newest
// result about the expectation's current text (cells never checked are absent), and the check runs still going.
import type { Knex } from "knex";
import type { ExpectationMatrix } from "@shared/schemas/expectations";
import { currentResults, listExpectations } from "../../db/repositories/expectations";
import { listRevisions } from "../../db/repositories/model-revisions";
import { HttpError } from "../../http/errors";

export async function expectationMatrix(db: Knex, projectId: string, modelId: string): Promise<ExpectationMatrix> {
  const model = await db("models").where({ id: modelId, project_id: projectId }).first("id");
  if (!model) throw new HttpError(404, "NOT_FOUND", "No such model in this project");
  const [expectations, revisions, cells, pending] = await Promise.all([
    listExpectations(db, modelId),
    listRevisions(db, modelId),
    currentResults(db, modelId),
    db("runs")
      .where({ project_id: projectId, kind: "expectation-check" })
      .whereIn("state", ["queued", "running"])
      .whereRaw("params->>'modelId' = ?", [modelId])
      .select("id"),
  ]);
  return {
    expectations: expectations.map((s) => ({
      id: s.id,
      key: s.expectation.id,
      source: s.expectation.source,
      note: s.expectation.note,
    })),
    revisions: revisions.map((r) => ({
      revision: r.revision,
      revisionId: r.id,
      nodeCount: r.nodeCount,
      createdBy: r.createdBy?.displayName ?? null,
      createdAt: r.createdAt,
    })),
    cells: cells.map(({ revisionId: _revisionId, ...cell }) => cell),
    pendingRunIds: pending.map((r) => r.id as string),
  };
}
