// Reductions, their review events and comment threads. Rows become the shared schema's shapes here; the
// certificate column is parsed with the shared zod schema so a damaged row is reported, never passed on.
import type { Knex } from "knex";
import {
  Certificate,
  type ReductionComment,
  type ReductionDetail,
  type ReductionNotion,
  type ReductionSummary,
  type ReviewState,
  type Verification,
} from "@shared/schemas/reductions";

interface ReductionRow {
  id: string;
  project_id: string;
  source_revision_id: string;
  target_revision_id: string | null;
  notion: ReductionNotion;
  time_scale: number;
  target_node_count: number;
  summary: { targetNames?: string[]; flags?: string[]; rank?: number };
  found_by: string | null;
  found_by_name: string | null;
  found_in_run_id: string | null;
  review_state: ReviewState;
  decided_by: string | null;
  decided_by_name: string | null;
  decided_at: Date | null;
  last_verification: Verification | null;
  created_at: Date;
  source_model_id: string;
  source_model_name: string;
  source_revision: number;
  target_model_id: string | null;
  target_model_name: string | null;
  target_revision: number | null;
}

function person(id: string | null, name: string | null) {
  return id ? { id, displayName: name ?? "" } : null;
}

function toSummary(r: ReductionRow): ReductionSummary {
  return {
    id: r.id,
    projectId: r.project_id,
    notion: r.notion,
    timeScale: r.time_scale,
    source: {
      modelId: r.source_model_id,
      modelName: r.source_model_name,
      revisionId: r.source_revision_id,
      revision: r.source_revision,
    },
    target:
      r.target_revision_id && r.target_model_id
        ? {
            modelId: r.target_model_id,
            modelName: r.target_model_name ?? "",
            revisionId: r.target_revision_id,
            revision: r.target_revision ?? 0,
          }
        : null,
    targetNodeCount: r.target_node_count,
    targetNames: r.summary.targetNames ?? [],
    flags: r.summary.flags ?? [],
    rank: r.summary.rank ?? 0,
    reviewState: r.review_state,
    foundBy: person(r.found_by, r.found_by_name),
    foundInRunId: r.found_in_run_id,
    decidedBy: person(r.decided_by, r.decided_by_name),
    decidedAt: r.decided_at ? r.decided_at.toISOString() : null,
    lastVerification: r.last_verification,
    createdAt: r.created_at.toISOString(),
  };
}

function summaryQuery(db: Knex) {
  return db("reductions as red")
    .join("model_revisions as sr", "sr.id", "red.source_revision_id")
    .join("models as sm", "sm.id", "sr.model_id")
    .leftJoin("model_revisions as tr", "tr.id", "red.target_revision_id")
    .leftJoin("models as tm", "tm.id", "tr.model_id")
    .leftJoin("users as fu", "fu.id", "red.found_by")
    .leftJoin("users as du", "du.id", "red.decided_by")
    .select(
      "red.id",
      "red.project_id",
      "red.source_revision_id",
      "red.target_revision_id",
      "red.notion",
      "red.time_scale",
      "red.target_node_count",
      "red.summary",
      "red.found_by",
      "red.found_in_run_id",
      "red.review_state",
      "red.decided_by",
      "red.decided_at",
      "red.last_verification",
      "red.created_at",
      "fu.display_name as found_by_name",
      "du.display_name as decided_by_name",
      "sm.id as source_model_id",
      "sm.name as source_model_name",
      "sr.revision as source_revision",
      "tm.id as target_model_id",
      "tm.name as target_model_name",
      "tr.revision as target_revision",
    );
}

export interface ReductionFilter {
  state?: ReviewState;
  notion?: ReductionNotion;
  sourceModelId?: string;
  /** A flag the reduction carries, or "none" for the unflagged ones. */
  flag?: string;
  minTargetNodes?: number;
  maxTargetNodes?: number;
  runId?: string;
  sort?: "newest" | "oldest" | "smallest" | "largest" | "rank";
}

const rankOrder = "coalesce((red.summary->>'rank')::int, 0)";

export async function listReductions(db: Knex, projectId: string, f: ReductionFilter): Promise<ReductionSummary[]> {
  const q = summaryQuery(db).where("red.project_id", projectId);
  if (f.state) q.andWhere("red.review_state", f.state);
  if (f.notion) q.andWhere("red.notion", f.notion);
  if (f.sourceModelId) q.andWhere("sm.id", f.sourceModelId);
  if (f.runId) q.andWhere("red.found_in_run_id", f.runId);
  if (f.minTargetNodes) q.andWhere("red.target_node_count", ">=", f.minTargetNodes);
  if (f.maxTargetNodes) q.andWhere("red.target_node_count", "<=", f.maxTargetNodes);
  if (f.flag === "none") q.andWhereRaw("coalesce(jsonb_array_length(red.summary->'flags'), 0) = 0");
  else if (f.flag) q.andWhereRaw("red.summary->'flags' \\? ?", [f.flag]);
  // Findings of one search share a timestamp (one transaction); within it they keep the search's ranking.
  const sort = f.sort ?? "newest";
  if (sort === "smallest" || sort === "largest")
    q.orderBy("red.target_node_count", sort === "smallest" ? "asc" : "desc");
  if (sort === "rank") q.orderByRaw(rankOrder);
  const rows = (await q
    .orderBy("red.created_at", sort === "oldest" ? "asc" : "desc")
    .orderByRaw(rankOrder)
    .orderBy("red.id")
    .limit(500)) as ReductionRow[];
  return rows.map(toSummary);
}

export async function findReduction(db: Knex, projectId: string, reductionId: string): Promise<ReductionDetail | null> {
  const row = (await summaryQuery(db)
    .select("red.certificate")
    .where({ "red.project_id": projectId, "red.id": reductionId })
    .first()) as (ReductionRow & { certificate: unknown }) | undefined;
  if (!row) return null;
  const events = (await db("reduction_events as e")
    .leftJoin("users as u", "u.id", "e.actor_id")
    .where("e.reduction_id", reductionId)
    .orderBy("e.created_at")
    .select("e.id", "e.kind", "e.actor_id", "u.display_name", "e.comment", "e.outcome", "e.created_at")) as {
    id: string;
    kind: "approve" | "reject" | "verify" | "reopen";
    actor_id: string | null;
    display_name: string | null;
    comment: string;
    outcome: Record<string, unknown> | null;
    created_at: Date;
  }[];
  return {
    ...toSummary(row),
    certificate: Certificate.parse(row.certificate),
    events: events.map((e) => ({
      id: e.id,
      kind: e.kind,
      actor: person(e.actor_id, e.display_name),
      comment: e.comment,
      outcome: e.outcome,
      createdAt: e.created_at.toISOString(),
    })),
    comments: await listComments(db, reductionId),
  };
}

export interface NewReduction {
  projectId: string;
  sourceRevisionId: string;
  targetRevisionId: string | null;
  notion: ReductionNotion;
  timeScale: number;
  certificate: Certificate;
  targetKey: string;
  flags: string[];
  foundBy: string | null;
  foundInRunId: string | null;
  /** Position in the search's ranking (0 = best); 0 for single results. */
  rank?: number;
}

/** Stores a reduction unless the same statement is already stored; returns its id and whether it was new. */
export async function insertReduction(db: Knex, r: NewReduction): Promise<{ id: string; isNew: boolean }> {
  const targetNames = r.certificate.target.nodes.map((n) => n.name);
  const inserted = (await db("reductions")
    .insert({
      project_id: r.projectId,
      source_revision_id: r.sourceRevisionId,
      target_revision_id: r.targetRevisionId,
      notion: r.notion,
      time_scale: r.timeScale,
      target_node_count: targetNames.length,
      target_key: r.targetKey,
      certificate: JSON.stringify(r.certificate),
      summary: JSON.stringify({ targetNames, flags: r.flags, rank: r.rank ?? 0 }),
      found_by: r.foundBy,
      found_in_run_id: r.foundInRunId,
    })
    .onConflict(db.raw("(project_id, source_revision_id, notion, time_scale, target_key)"))
    .ignore()
    .returning("id")) as { id: string }[];
  if (inserted[0]) return { id: inserted[0].id, isNew: true };
  const existing = (await db("reductions")
    .where({
      project_id: r.projectId,
      source_revision_id: r.sourceRevisionId,
      notion: r.notion,
      time_scale: r.timeScale,
      target_key: r.targetKey,
    })
    .first("id")) as { id: string };
  return { id: existing.id, isNew: false };
}

export async function setReviewState(
  trx: Knex,
  reductionId: string,
  state: ReviewState,
  deciderId: string,
): Promise<void> {
  await trx("reductions")
    .where({ id: reductionId })
    .update({ review_state: state, decided_by: deciderId, decided_at: trx.fn.now() });
}

export async function setVerification(trx: Knex, reductionId: string, v: Verification): Promise<void> {
  await trx("reductions")
    .where({ id: reductionId })
    .update({ last_verification: JSON.stringify(v) });
}

export async function setTargetRevision(trx: Knex, reductionId: string, targetRevisionId: string): Promise<void> {
  await trx("reductions").where({ id: reductionId }).update({ target_revision_id: targetRevisionId });
}

export async function insertEvent(
  trx: Knex,
  e: {
    reductionId: string;
    actorId: string;
    kind: "approve" | "reject" | "verify" | "reopen";
    comment: string;
    outcome?: Record<string, unknown>;
  },
): Promise<void> {
  await trx("reduction_events").insert({
    reduction_id: e.reductionId,
    actor_id: e.actorId,
    kind: e.kind,
    comment: e.comment,
    outcome: e.outcome ? JSON.stringify(e.outcome) : null,
  });
}

export async function listComments(db: Knex, reductionId: string): Promise<ReductionComment[]> {
  const rows = (await db("reduction_comments as c")
    .leftJoin("users as u", "u.id", "c.author_id")
    .where("c.reduction_id", reductionId)
    .orderBy([{ column: "c.created_at" }, { column: "c.id" }])
    .select("c.id", "c.parent_id", "c.author_id", "u.display_name", "c.body", "c.created_at")) as {
    id: string;
    parent_id: string | null;
    author_id: string | null;
    display_name: string | null;
    body: string;
    created_at: Date;
  }[];
  return rows.map((c) => ({
    id: c.id,
    parentId: c.parent_id,
    author: person(c.author_id, c.display_name),
    body: c.body,
    createdAt: c.created_at.toISOString(),
  }));
}

export async function insertComment(
  db: Knex,
  c: { reductionId: string; parentId: string | null; authorId: string; body: string },
): Promise<string> {
  const [row] = (await db("reduction_comments")
    .insert({ reduction_id: c.reductionId, parent_id: c.parentId, author_id: c.authorId, body: c.body })
    .returning("id")) as { id: string }[];
  return row!.id;
}

export async function commentBelongsTo(db: Knex, commentId: string, reductionId: string): Promise<boolean> {
  return Boolean(await db("reduction_comments").where({ id: commentId, reduction_id: reductionId }).first("id"));
}

/** Approved reductions between stored models of the project: the edges of the model hierarchy. */
export async function approvedModelEdges(
  db: Knex,
  projectId: string,
): Promise<
  {
    id: string;
    notion: ReductionNotion;
    timeScale: number;
    sourceModelId: string;
    targetModelId: string;
    certificate: Certificate;
  }[]
> {
  const rows = (await db("reductions as red")
    .join("model_revisions as sr", "sr.id", "red.source_revision_id")
    .join("model_revisions as tr", "tr.id", "red.target_revision_id")
    .where({ "red.project_id": projectId, "red.review_state": "approved" })
    .select(
      "red.id",
      "red.notion",
      "red.time_scale",
      "sr.model_id as source_model_id",
      "tr.model_id as target_model_id",
      "red.certificate",
    )) as {
    id: string;
    notion: ReductionNotion;
    time_scale: number;
    source_model_id: string;
    target_model_id: string;
    certificate: unknown;
  }[];
  return rows.map((r) => ({
    id: r.id,
    notion: r.notion,
    timeScale: r.time_scale,
    sourceModelId: r.source_model_id,
    targetModelId: r.target_model_id,
    certificate: Certificate.parse(r.certificate),
  }));
}
