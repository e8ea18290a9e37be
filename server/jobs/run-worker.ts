// A worker: takes shard jobs from the queue, computes each in the thread pool, and owns every database write
// about it (claim, heartbeats with checkpoints, completion, the final merge). Any number of worker processes on
// any machines can share one DATABASE_URL. Each also reaps: it re-queues shards whose holder stopped sending
// heartbeats (killed process, lost machine) and finishes merges a dead worker left undone.
import { randomUUID } from "node:crypto";
import os from "node:os";
import { MessageChannel } from "node:worker_threads";
import type { Knex } from "knex";
import type PgBoss from "pg-boss";
import type { Piscina } from "piscina";
import type { Logger } from "pino";
import { isRunFinished, type Run, type RunError } from "@shared/schemas/runs";
import {
  claimShard,
  completeShard,
  mergeRunOnce,
  releaseShard,
  requeueStaleShard,
  runsAwaitingMerge,
  setShardJob,
  shardsOf,
  shardsWithoutJob,
  staleShards,
  type Shard,
} from "../db/repositories/run-shards";
import { finishRun, getRun, refreshRunProgress, tryStartRun } from "../db/repositories/runs";
import type { Mailer } from "../mail/mailer";
import { createWorkerPool } from "../workers/pool";
import {
  StopReason,
  type MergeTaskInput,
  type MergeTaskOutput,
  type ShardTaskInput,
  type ShardTaskOutput,
} from "../workers/task-protocol";
import { retrying, SHARD_QUEUE, sendShardJob, startBoss, type ShardJobData } from "./boss";
import { runKind } from "./kinds";
import { notifyRunFinished } from "./notify";
import { bossRunQueue, promoteNextRun } from "./run-queue";
import type { RunKindDefinition } from "./run-kind";
import type { RunSettings } from "./run-settings";
import { startShardHeartbeat } from "./shard-heartbeat";
import { shardOutcome, type ShardEnd } from "./shard-outcome";
import { ReductionSearchResult } from "@shared/schemas/reductions";
import { notifyReviewWaiting } from "../services/notifications/notify-people";

export interface RunWorkerDeps {
  db: Knex;
  log: Logger;
  databaseUrl: string;
  mailer: Mailer | null;
  publicUrl: string;
  settings: RunSettings;
}

export interface RunWorker {
  readonly pool: Piscina;
  /** Stops taking jobs; shards in progress keep their checkpoint and go back to the queue for another worker. */
  stop(): Promise<void>;
}

/** Seconds a run whose project has no free slot waits before its shard job is looked at again. */
const WAIT_FOR_SLOT_SECONDS = 2;

type Job = PgBoss.JobWithMetadata<ShardJobData>;

/** What every step of one worker process shares. */
interface Worker extends RunWorkerDeps {
  boss: PgBoss;
  pool: Piscina;
  /** The stop flags of the shards computing now, so stop() can ask each to hand its shard back. */
  stopFlags: Set<Int32Array>;
  name: string;
}

/** Every run that ends in a worker passes here: the next run of its project may now jump the queue. */
async function notify(w: Worker, run: Run): Promise<void> {
  try {
    await promoteNextRun(w.db, bossRunQueue(w.boss), run.projectId);
  } catch (err) {
    w.log.warn({ err: { message: (err as Error).message }, runId: run.id }, "promoting the project's next run failed");
  }
  try {
    await notifyRunFinished(
      {
        db: w.db,
        log: w.log,
        mailer: w.mailer,
        publicUrl: w.publicUrl,
        notifyAfterSeconds: w.settings.notifyAfterSeconds,
      },
      run,
    );
    await notifySearchFindings(w, run);
  } catch (err) {
    w.log.warn({ err: { message: (err as Error).message }, runId: run.id }, "run notification failed");
  }
}

/** A search that stored reductions leaves work for the project's reviewers. */
async function notifySearchFindings(w: Worker, run: Run): Promise<void> {
  if (run.kind !== "reduction-search" || run.state !== "succeeded") return;
  const stored = ReductionSearchResult.safeParse(run.result);
  if (!stored.success) return;
  const count = stored.data.reductionIds.length;
  await notifyReviewWaiting(
    { db: w.db, log: w.log, mailer: w.mailer, publicUrl: w.publicUrl },
    run.projectId,
    run.startedBy,
    count,
    `A search found ${count === 1 ? "a reduction" : `${count} reductions`} worth reviewing.`,
  );
}

async function failRun(w: Worker, runId: string, error: RunError): Promise<void> {
  const run = await retrying("finish run", w.log, () => finishRun(w.db, runId, "failed", { error }));
  if (run) await notify(w, run);
}

/** A long merge runs in the pool before taking the run's lock; done shards never change, so its input is final. */
async function mergeInPool(w: Worker, kind: RunKindDefinition, runId: string, params: unknown) {
  const shards = await retrying("read shards", w.log, () => shardsOf(w.db, runId));
  if (shards.some((s) => s.state !== "done")) return null;
  try {
    const input: MergeTaskInput = { partials: shards.map((s) => s.partial), params };
    return (await w.pool.run(input, { filename: kind.mergeTaskFile })) as MergeTaskOutput;
  } catch (err) {
    const oom = (err as { code?: string }).code === "ERR_WORKER_OUT_OF_MEMORY";
    const error: RunError = oom
      ? { code: "MEMORY_LIMIT", message: `Merging needed more than ${w.settings.workerMemoryMb} MB of memory` }
      : { code: "MERGE_FAILED", message: (err as Error).message };
    return { ok: false, error } satisfies MergeTaskOutput;
  }
}

/** Merges a run whose shards are all done, exactly once (whichever worker gets there first), and notifies. */
async function mergeAndNotify(w: Worker, runId: string): Promise<void> {
  const run = await retrying("read run", w.log, () => getRun(w.db, runId));
  const kind = run && runKind(run.kind);
  if (!run || !kind || run.state !== "running") return;
  const params = kind.params.parse(run.params);
  let merge = (partials: unknown[]) =>
    kind.merge(
      partials.map((p) => kind.task.partial.parse(p)),
      params,
    );
  if (kind.mergeTaskFile) {
    const out = await mergeInPool(w, kind, runId, params);
    if (!out) return;
    if (!out.ok) return failRun(w, runId, out.error);
    merge = () => out.result;
  }
  const merged = await retrying("merge run", w.log, () => mergeRunOnce(w.db, runId, merge, kind.afterMerge));
  if (!merged) return;
  w.log.info({ runId }, "run succeeded");
  const finished = await getRun(w.db, runId);
  if (finished) await notify(w, finished);
}

/** Runs the shard's task in the pool with a heartbeat, then carries out what shardOutcome decides. */
async function executeShard(w: Worker, run: Run, kind: RunKindDefinition, shard: Shard, lease: string, job: Job) {
  const stopFlag = new Int32Array(new SharedArrayBuffer(4));
  const { port1, port2 } = new MessageChannel();
  const heartbeat = startShardHeartbeat(w, {
    runId: run.id,
    shard,
    lease,
    port: port1,
    everyMs: w.settings.heartbeatMs,
    requestStop: (reason) => Atomics.compareExchange(stopFlag, 0, StopReason.none, reason),
  });
  w.stopFlags.add(stopFlag);
  let ended: ShardEnd["ended"];
  try {
    const task: ShardTaskInput = {
      input: shard.input,
      cursor: shard.cursor,
      partial: shard.partial,
      port: port2,
      stopFlag,
    };
    ended = {
      returned: (await w.pool.run(task, { filename: kind.task.file, transferList: [port2] as never })) as
        ShardTaskOutput | undefined,
    };
  } catch (err) {
    ended = { threw: err };
  } finally {
    heartbeat.stop();
    w.stopFlags.delete(stopFlag);
  }
  const outcome = shardOutcome({
    stopReason: Atomics.load(stopFlag, 0),
    ended,
    retryCount: job.retryCount,
    retryLimit: job.retryLimit,
    timeLimitSeconds: run.timeLimitSeconds,
    workerMemoryMb: w.settings.workerMemoryMb,
  });
  switch (outcome.action) {
    case "drop":
      return;
    case "hand-back": {
      // Keep what was counted, then give the shard to another worker right away.
      await heartbeat.saveLastCheckpoint();
      await releaseShard(w.db, shard.id, lease, false);
      await setShardJob(w.db, shard.id, await sendShardJob(w.boss, { runId: run.id, shardId: shard.id }));
      return;
    }
    case "fail-run":
      return failRun(w, run.id, outcome.error);
    case "retry":
      // pg-boss retries this job; give the shard back so the retry can claim it at once.
      await retrying("release shard", w.log, () => releaseShard(w.db, shard.id, lease, true));
      throw outcome.error;
    case "complete": {
      const completed = await retrying("complete shard", w.log, () =>
        completeShard(w.db, shard.id, lease, outcome.partial),
      );
      if (!completed) return;
      await retrying("run progress", w.log, () => refreshRunProgress(w.db, run.id, heartbeat.latest.phase));
      await mergeAndNotify(w, run.id);
    }
  }
}

/** One shard job: start the run if its project has a free slot, claim the shard, compute it. */
async function handleJob(w: Worker, job: Job): Promise<void> {
  const { runId, shardId } = job.data;
  const run = await retrying("read run", w.log, () => getRun(w.db, runId));
  if (!run || isRunFinished(run.state)) return;
  const kind = runKind(run.kind);
  if (!kind)
    return failRun(w, runId, { code: "UNKNOWN_KIND", message: `This worker does not know run kind "${run.kind}"` });
  const start = await retrying("start run", w.log, () => tryStartRun(w.db, runId, w.settings.projectConcurrency));
  if (start === "finished") return;
  if (start === "wait") {
    const next = await sendShardJob(w.boss, { runId, shardId }, WAIT_FOR_SLOT_SECONDS);
    await retrying("record job", w.log, () => setShardJob(w.db, shardId, next));
    return;
  }
  const lease = randomUUID();
  const shard = await retrying("claim shard", w.log, () =>
    claimShard(w.db, shardId, lease, job.id, w.settings.staleSeconds, w.name),
  );
  // Done already, or held by a live worker: this job is a duplicate and has nothing to do.
  if (!shard) return;
  await executeShard(w, run, kind, shard, lease, job);
}

/** Re-queues shards whose holder went silent, re-sends jobs that were never sent, and finishes abandoned merges. */
async function reap(w: Worker): Promise<void> {
  const { db, settings } = w;
  for (const s of await staleShards(db, settings.staleSeconds)) {
    if (!(await requeueStaleShard(db, s.id, settings.staleSeconds))) continue;
    w.log.info({ shardId: s.id, runId: s.runId }, "re-queued a shard whose worker stopped responding");
    await setShardJob(db, s.id, await sendShardJob(w.boss, { runId: s.runId, shardId: s.id }));
  }
  for (const s of await shardsWithoutJob(db, Math.max(10, settings.staleSeconds))) {
    await setShardJob(db, s.id, await sendShardJob(w.boss, { runId: s.runId, shardId: s.id }));
  }
  for (const runId of await runsAwaitingMerge(db)) await mergeAndNotify(w, runId);
}

export async function startRunWorker(deps: RunWorkerDeps): Promise<RunWorker> {
  const { log, settings } = deps;
  const w: Worker = {
    ...deps,
    boss: await startBoss(deps.databaseUrl, log, { supervise: true }),
    pool: createWorkerPool(settings.threads, settings.workerMemoryMb),
    stopFlags: new Set(),
    name: `${os.hostname()}:${process.pid}`,
  };
  const handlers = new Set<Promise<void>>();
  let stopping = false;
  let reaping = false;

  const track = (p: Promise<void>) => {
    handlers.add(p);
    void p.finally(() => handlers.delete(p)).catch(() => {});
    return p;
  };
  // One pg-boss poller per thread, each handling one job at a time, keeps every thread busy and no more.
  for (let i = 0; i < Math.max(1, settings.threads); i++) {
    let pollerId = "";
    pollerId = await w.boss.work<ShardJobData>(
      SHARD_QUEUE,
      { batchSize: 1, pollingIntervalSeconds: 0.5, includeMetadata: true },
      async ([job]) => {
        // pg-boss waits a polling interval after every fetch; while jobs keep coming, fetch the next one at once.
        if (!stopping) w.boss.notifyWorker(pollerId);
        return track(handleJob(w, job!));
      },
    );
  }
  const reaper = setInterval(() => {
    if (reaping || stopping) return;
    reaping = true;
    reap(w)
      .catch((err) => log.warn({ err: { message: (err as Error).message } }, "reaper pass failed"))
      .finally(() => (reaping = false));
  }, settings.reapEveryMs);
  log.info({ threads: settings.threads }, "run worker started");

  return {
    pool: w.pool,
    async stop() {
      if (stopping) return;
      stopping = true;
      clearInterval(reaper);
      await w.boss.offWork(SHARD_QUEUE);
      for (const f of w.stopFlags) Atomics.compareExchange(f, 0, StopReason.none, StopReason.shutdown);
      await Promise.allSettled([...handlers]);
      await w.boss.stop({ graceful: true, wait: true, timeout: 10_000 });
      await w.pool.destroy();
    },
  };
}
