// Runs: one row per requested analysis; shards are in run-shards.ts. Rows become the shared Run shape here.
import type { Knex } from "knex";
import type { Run, RunError, RunModelRef, RunState } from "@shared/schemas/runs";
import { queuePositions, type UnfinishedRun } from "../../jobs/queue-order";

interface RunRow {
  id: string;
  project_id: string;
  model_revision_id: string | null;
  kind: string;
  params: unknown;
  params_hash: string;
  started_by: string | null;
  state: RunState;
  progress_fraction: number;
  progress_phase: string;
  shard_count: number;
  time_limit_seconds: number;
  created_at: Date;
  started_at: Date | null;
  finished_at: Date | null;
  result: unknown;
  error: RunError | null;
  attempt: number;
  shards_done?: number | string;
  model?: RunModelRef | null;
  target_model?: RunModelRef | null;
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function toRun(r: RunRow): Run {
  return {
    id: r.id,
    projectId: r.project_id,
    modelRevisionId: r.model_revision_id,
    kind: r.kind,
    params: r.params,
    paramsHash: r.params_hash,
    startedBy: r.started_by,
    state: r.state,
    progressFraction: Number(r.progress_fraction),
    progressPhase: r.progress_phase,
    shardCount: r.shard_count,
    shardsDone: Number(r.shards_done ?? 0),
    timeLimitSeconds: r.time_limit_seconds,
    createdAt: r.created_at.toISOString(),
    queuePosition: null,
    startedAt: iso(r.started_at),
    finishedAt: iso(r.finished_at),
    result: r.result ?? null,
    error: r.error ?? null,
    attempt: r.attempt,
    model: r.model ?? null,
    targetModel: r.target_model ?? null,
  };
}

const shardsDone = "(select count(*) from run_shards s where s.run_id = runs.id and s.state = 'done') as shards_done";
const modelRef = (revisionId: string, as: string) =>
  `(select json_build_object('modelId', m.id, 'modelName', m.name, 'revision', mr.revision) from model_revisions mr
     join models m on m.id = mr.model_id where mr.id::text = ${revisionId}) as ${as}`;
// Names of the models a run worked on, read with the run so that lists can title runs without a query per row.
const modelNames = `${modelRef("runs.model_revision_id::text", "model")}, ${modelRef("runs.params->>'targetRevisionId'", "target_model")}`;

export interface NewRun {
  projectId: string;
  modelRevisionId: string | null;
  kind: string;
  params: unknown;
  paramsHash: string;
  startedBy: string | null;
  timeLimitSeconds: number;
  shardInputs: unknown[];
}

/** Inserts the run and its shards in one transaction; the caller enqueues the shard jobs afterwards. */
export async function insertRun(db: Knex, r: NewRun): Promise<{ run: Run; shardIds: string[] }> {
  return db.transaction(async (trx) => {
    const [row] = await trx("runs")
      .insert({
        project_id: r.projectId,
        model_revision_id: r.modelRevisionId,
        kind: r.kind,
        params: JSON.stringify(r.params),
        params_hash: r.paramsHash,
        started_by: r.startedBy,
        time_limit_seconds: r.timeLimitSeconds,
        shard_count: r.shardInputs.length,
      })
      .returning("*");
    const shards = await trx("run_shards")
      .insert(r.shardInputs.map((input, i) => ({ run_id: row.id, shard_index: i, input: JSON.stringify(input) })))
      .returning(["id", "shard_index"]);
    shards.sort((a, b) => a.shard_index - b.shard_index);
    return { run: toRun({ ...row, shards_done: 0 }), shardIds: shards.map((s) => s.id as string) };
  });
}

export async function findReusableRun(
  db: Knex,
  key: { projectId: string; kind: string; modelRevisionId: string | null; paramsHash: string },
): Promise<Run | null> {
  const q = db("runs")
    .select("*", db.raw(shardsDone), db.raw(modelNames))
    .where({ project_id: key.projectId, kind: key.kind, params_hash: key.paramsHash, state: "succeeded" });
  if (key.modelRevisionId) q.where("model_revision_id", key.modelRevisionId);
  else q.whereNull("model_revision_id");
  const row = await q.first();
  return row ? toRun(row) : null;
}

export async function getRun(db: Knex, runId: string, projectId?: string): Promise<Run | null> {
  const q = db("runs").select("*", db.raw(shardsDone), db.raw(modelNames)).where({ id: runId });
  if (projectId) q.where({ project_id: projectId });
  const row = await q.first();
  return row ? toRun(row) : null;
}

export async function listRuns(
  db: Knex,
  projectId: string,
  f: { kind?: string; state?: RunState; limit: number },
): Promise<Run[]> {
  const q = db("runs")
    .select("*", db.raw(shardsDone), db.raw(modelNames))
    .where({ project_id: projectId })
    .orderBy("created_at", "desc")
    .limit(f.limit);
  if (f.kind) q.where({ kind: f.kind });
  if (f.state) q.where({ state: f.state });
  return (await q).map(toRun);
}

export async function countUnfinishedRuns(db: Knex, projectId: string): Promise<number> {
  const row = await db("runs")
    .where({ project_id: projectId })
    .whereIn("state", ["queued", "running"])
    .count<{ count: string }[]>("* as count")
    .first();
  return Number(row?.count ?? 0);
}

/** Moves a queued run to running unless the project already has `limit` runs running; true when it may start. */
export async function tryStartRun(
  db: Knex,
  runId: string,
  limit: number,
): Promise<"started" | "running" | "wait" | "finished"> {
  return db.transaction(async (trx) => {
    const run = await trx("runs").where({ id: runId }).forUpdate().first();
    if (!run) return "finished";
    if (run.state === "running") return "running";
    if (run.state !== "queued") return "finished";
    // Serialise starts per project so two workers cannot both see "one slot left".
    await trx.raw("select pg_advisory_xact_lock(hashtext(?))", [`runs:${run.project_id}`]);
    const row = await trx("runs")
      .where({ project_id: run.project_id, state: "running" })
      .count<{ count: string }[]>("* as count")
      .first();
    if (Number(row?.count ?? 0) >= limit) return "wait";
    await trx("runs")
      .where({ id: runId })
      .update({ state: "running", started_at: trx.fn.now(), progress_phase: "starting" });
    return "started";
  });
}

/** Marks a run finished only if it is still unfinished; answers the updated run or null when nothing changed. */
export async function finishRun(
  db: Knex,
  runId: string,
  state: "succeeded" | "failed" | "cancelled",
  out: { result?: unknown; error?: RunError },
): Promise<Run | null> {
  const [row] = await db("runs")
    .where({ id: runId })
    .whereIn("state", ["queued", "running"])
    .update({
      state,
      finished_at: db.fn.now(),
      result: out.result === undefined ? null : JSON.stringify(out.result),
      error: out.error ? JSON.stringify(out.error) : null,
      ...(state === "succeeded" ? { progress_fraction: 1, progress_phase: "done" } : { progress_phase: state }),
    })
    .returning("*");
  return row ? toRun(row) : null;
}

/** Rewrites a finished run's result (a finding proposed later records its reduction there). */
export async function setRunResult(db: Knex, runId: string, result: unknown): Promise<void> {
  await db("runs")
    .where({ id: runId })
    .update({ result: JSON.stringify(result) });
}

/** Puts a failed or cancelled run back in the queue; finished shards and every checkpoint are kept. */
export async function resetRunForRetry(db: Knex, runId: string): Promise<string[] | null> {
  return db.transaction(async (trx) => {
    const [row] = await trx("runs")
      .where({ id: runId })
      .whereIn("state", ["failed", "cancelled"])
      .update({
        state: "queued",
        finished_at: null,
        started_at: null,
        error: null,
        result: null,
        progress_phase: "queued",
        attempt: trx.raw("attempt + 1"),
      })
      .returning("id");
    if (!row) return null;
    const shards = await trx("run_shards")
      .where({ run_id: runId })
      .whereNot({ state: "done" })
      .update({ state: "queued", lease: null, heartbeat_at: null, boss_job_id: null, queued_at: trx.fn.now() })
      .returning("id");
    return shards.map((s) => s.id as string);
  });
}

export async function deleteRun(db: Knex, runId: string): Promise<boolean> {
  return (await db("runs").where({ id: runId }).del()) > 0;
}

export async function runState(
  db: Knex,
  runId: string,
): Promise<{ state: RunState; startedAt: Date | null; timeLimitSeconds: number; now: Date } | null> {
  const row = await db("runs")
    .where({ id: runId })
    .select("state", "started_at", "time_limit_seconds", db.raw("now() as now"))
    .first();
  return row
    ? { state: row.state, startedAt: row.started_at, timeLimitSeconds: row.time_limit_seconds, now: row.now }
    : null;
}

/** Run progress is the mean of its shards' fractions; the phase is the latest shard's. */
export async function refreshRunProgress(db: Knex, runId: string, phase: string): Promise<void> {
  await db("runs")
    .where({ id: runId, state: "running" })
    .update({
      progress_fraction: db.raw(
        "least(1, (select coalesce(avg(case when s.state = 'done' then 1 else s.progress_fraction end), 0) from run_shards s where s.run_id = runs.id))",
      ),
      progress_phase: phase,
    });
}

/** The rule text of a model revision of this project, or null when the revision is not in the project. */
export async function revisionRuleText(db: Knex, projectId: string, revisionId: string): Promise<string | null> {
  const row = await db("model_revisions as r")
    .join("models as m", "m.id", "r.model_id")
    .where("r.id", revisionId)
    .where("m.project_id", projectId)
    .select("r.rule_text")
    .first();
  return row ? (row.rule_text as string) : null;
}

/** Every queued or running run in outline, oldest first: what the queue order (jobs/queue-order.ts) is decided on. */
export async function unfinishedRuns(db: Knex, projectId?: string): Promise<UnfinishedRun[]> {
  const q = db("runs")
    .select("id", "project_id", "created_at", "state")
    .whereIn("state", ["queued", "running"])
    .orderBy([{ column: "created_at" }, { column: "id" }]);
  if (projectId) q.where({ project_id: projectId });
  const rows: { id: string; project_id: string; created_at: Date; state: "queued" | "running" }[] = await q;
  return rows.map((r) => ({ id: r.id, projectId: r.project_id, createdAt: r.created_at.getTime(), state: r.state }));
}

/** The runs with each queued one's place in the queue filled in. */
export async function withQueuePositions<R extends Run>(db: Knex, runs: R[]): Promise<R[]> {
  if (!runs.some((r) => r.state === "queued")) return runs;
  const positions = queuePositions(await unfinishedRuns(db));
  return runs.map((r) => (r.state === "queued" ? { ...r, queuePosition: positions.get(r.id) ?? null } : r));
}

/** The unfinished shards of a run, in shard order (the first one is the run's start). */
export async function unfinishedShardIds(db: Knex, runId: string): Promise<string[]> {
  const rows: { id: string }[] = await db("run_shards")
    .select("id")
    .where({ run_id: runId })
    .whereNot({ state: "done" })
    .orderBy("shard_index");
  return rows.map((r) => r.id);
}
