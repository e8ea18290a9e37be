// Shards of a run. Every write that changes who holds a shard or what it has counted is guarded by the holder's
// lease, and completion is keyed by shard id, so a worker that was killed, or came back after an outage, can
// neither lose a shard nor count one twice.
import type { Knex } from "knex";

export interface Shard {
  id: string;
  runId: string;
  shardIndex: number;
  input: unknown;
  state: "queued" | "running" | "done";
  cursor: unknown;
  partial: unknown;
  lease: string | null;
  claims: number;
}

interface ShardRow {
  id: string;
  run_id: string;
  shard_index: number;
  input: unknown;
  state: Shard["state"];
  cursor: unknown;
  partial: unknown;
  lease: string | null;
  claims: number;
}
const toShard = (r: ShardRow): Shard => ({
  id: r.id,
  runId: r.run_id,
  shardIndex: r.shard_index,
  input: r.input,
  state: r.state,
  cursor: r.cursor,
  partial: r.partial,
  lease: r.lease,
  claims: r.claims,
});

/**
 * Takes a shard for this worker: possible when it is queued, or running with a heartbeat older than staleSeconds
 * (its holder died). Answers the shard with the new lease, or null when it is done or held by a live worker.
 */
export async function claimShard(
  db: Knex,
  shardId: string,
  lease: string,
  bossJobId: string,
  staleSeconds: number,
  heldBy: string,
): Promise<Shard | null> {
  const [row] = await db("run_shards")
    .where({ id: shardId })
    .andWhere((w) =>
      w
        .where({ state: "queued" })
        .orWhere((w2) =>
          w2
            .where({ state: "running" })
            .andWhere((w3) =>
              w3
                .whereNull("heartbeat_at")
                .orWhere("heartbeat_at", "<", db.raw("now() - make_interval(secs => ?)", [staleSeconds])),
            ),
        ),
    )
    .update({
      state: "running",
      lease,
      held_by: heldBy,
      heartbeat_at: db.fn.now(),
      boss_job_id: bossJobId,
      claims: db.raw("claims + 1"),
    })
    .returning("*");
  return row ? toShard(row) : null;
}

/** Heartbeat plus optional checkpoint and progress; false means the lease was lost (another worker took over). */
export async function recordShardProgress(
  db: Knex,
  shardId: string,
  lease: string,
  p: { fraction: number; phase: string; checkpoint?: { cursor: unknown; partial: unknown } },
): Promise<boolean> {
  const patch: Record<string, unknown> = {
    heartbeat_at: db.fn.now(),
    progress_fraction: Math.min(1, Math.max(0, p.fraction)),
    progress_phase: p.phase,
  };
  if (p.checkpoint) {
    patch.cursor = JSON.stringify(p.checkpoint.cursor);
    patch.partial = JSON.stringify(p.checkpoint.partial);
  }
  const n = await db("run_shards").where({ id: shardId, lease, state: "running" }).update(patch);
  return n > 0;
}

/** Stores the shard's final partial result once; false when it was already done or the lease was lost. */
export async function completeShard(db: Knex, shardId: string, lease: string, partial: unknown): Promise<boolean> {
  const n = await db("run_shards")
    .where({ id: shardId, lease, state: "running" })
    .update({
      state: "done",
      partial: JSON.stringify(partial),
      cursor: null,
      progress_fraction: 1,
      completed_at: db.fn.now(),
      lease: null,
    });
  return n > 0;
}

/**
 * Gives a shard back to the queue, keeping its checkpoint. With keepJob the current queue job stays its job (pg-boss
 * will retry it); without, the caller sends a new job (and the reaper re-sends if that send is lost).
 */
export async function releaseShard(db: Knex, shardId: string, lease: string, keepJob: boolean): Promise<void> {
  await db("run_shards")
    .where({ id: shardId, lease, state: "running" })
    .update({
      state: "queued",
      lease: null,
      heartbeat_at: null,
      queued_at: db.fn.now(),
      ...(keepJob ? {} : { boss_job_id: null }),
    });
}

export async function setShardJob(db: Knex, shardId: string, bossJobId: string): Promise<void> {
  await db("run_shards").where({ id: shardId }).update({ boss_job_id: bossJobId });
}

/** Shards of running runs whose holder stopped sending heartbeats. */
export async function staleShards(
  db: Knex,
  staleSeconds: number,
): Promise<{ id: string; runId: string; bossJobId: string | null }[]> {
  const rows = await db("run_shards as s")
    .join("runs as r", "r.id", "s.run_id")
    .where("r.state", "running")
    .where("s.state", "running")
    .where("s.heartbeat_at", "<", db.raw("now() - make_interval(secs => ?)", [staleSeconds]))
    .select("s.id", "s.run_id", "s.boss_job_id")
    .limit(100);
  return rows.map((r) => ({ id: r.id, runId: r.run_id, bossJobId: r.boss_job_id }));
}

/**
 * Puts a shard whose holder stopped sending heartbeats back in the queue, once: of several reapers only the one
 * whose update matches wins and sends the new job.
 */
export async function requeueStaleShard(db: Knex, shardId: string, staleSeconds: number): Promise<boolean> {
  const n = await db("run_shards")
    .where({ id: shardId, state: "running" })
    .where("heartbeat_at", "<", db.raw("now() - make_interval(secs => ?)", [staleSeconds]))
    .update({ state: "queued", lease: null, heartbeat_at: null, boss_job_id: null, queued_at: db.fn.now() });
  return n > 0;
}

/** Queued shards of live runs that have no queue job (a send failed, e.g. during a database outage). */
export async function shardsWithoutJob(db: Knex, olderThanSeconds: number): Promise<{ id: string; runId: string }[]> {
  const rows = await db("run_shards as s")
    .join("runs as r", "r.id", "s.run_id")
    .whereIn("r.state", ["queued", "running"])
    .where("s.state", "queued")
    .whereNull("s.boss_job_id")
    .where("s.queued_at", "<", db.raw("now() - make_interval(secs => ?)", [olderThanSeconds]))
    .select("s.id", "s.run_id")
    .limit(100);
  return rows.map((r) => ({ id: r.id, runId: r.run_id }));
}

/** Runs that are running with every shard done: their merge was interrupted (the merging worker died). */
export async function runsAwaitingMerge(db: Knex): Promise<string[]> {
  const rows = await db("runs as r")
    .where("r.state", "running")
    .whereNotExists(db("run_shards as s").whereRaw("s.run_id = r.id").whereNot("s.state", "done").select(db.raw("1")))
    .select("r.id")
    .limit(100);
  return rows.map((r) => r.id as string);
}

/** Kind-specific writes of a merged result (e.g. reductions found by a search); answers the result to store. */
export type AfterMerge = (
  trx: Knex,
  run: { id: string; projectId: string; startedBy: string | null },
  result: unknown,
  params: unknown,
) => Promise<unknown>;

/**
 * Merges the shards' partial results exactly once: the run row is locked, and the merge happens only while the
 * run is still running and every shard is done. Answers the merged result, or null when there was nothing to do.
 */
export async function mergeRunOnce<R>(
  db: Knex,
  runId: string,
  merge: (partials: unknown[]) => R,
  afterMerge?: AfterMerge,
): Promise<{ result: unknown } | null> {
  return db.transaction(async (trx) => {
    const run = await trx("runs").where({ id: runId }).forUpdate().first();
    if (!run || run.state !== "running") return null;
    const shards = await trx("run_shards").where({ run_id: runId }).orderBy("shard_index").select("state", "partial");
    if (shards.some((s) => s.state !== "done")) return null;
    const merged = merge(shards.map((s) => s.partial));
    // Whatever a kind stores from its result is written in this transaction, so the run never succeeds without it.
    const result = afterMerge
      ? await afterMerge(trx, { id: run.id, projectId: run.project_id, startedBy: run.started_by }, merged, run.params)
      : merged;
    await trx("runs")
      .where({ id: runId })
      .update({
        state: "succeeded",
        result: JSON.stringify(result),
        finished_at: trx.fn.now(),
        progress_fraction: 1,
        progress_phase: "done",
      });
    return { result };
  });
}

export async function shardsOf(db: Knex, runId: string): Promise<Shard[]> {
  return (await db("run_shards").where({ run_id: runId }).orderBy("shard_index")).map(toShard);
}
