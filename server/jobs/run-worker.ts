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
  recordShardProgress,
  releaseShard,
  requeueStaleShard,
  runsAwaitingMerge,
  setShardJob,
  shardsOf,
  shardsWithoutJob,
  staleShards,
  type Shard,
} from "../db/repositories/run-shards";
import { finishRun, getRun, refreshRunProgress, runState, tryStartRun } from "../db/repositories/runs";
import type { Mailer } from "../mail/mailer";
import { createWorkerPool } from "../workers/pool";
import { StopReason, type ShardTaskOutput, type TaskMessage } from "../workers/task-protocol";
import { retrying, SHARD_QUEUE, sendShardJob, startBoss, type ShardJobData } from "./boss";
import { runKind } from "./kinds";
import { notifyRunFinished } from "./notify";
import type { MergeTaskInput, RunKindDefinition } from "./run-kind";
import type { RunSettings } from "./run-settings";

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

export async function startRunWorker(deps: RunWorkerDeps): Promise<RunWorker> {
  const { db, log, settings } = deps;
  const boss = await startBoss(deps.databaseUrl, log, { supervise: true });
  const pool = createWorkerPool(settings.threads, settings.workerMemoryMb);
  const stopFlags = new Set<Int32Array>();
  const handlers = new Set<Promise<void>>();
  let stopping = false;
  const workerName = `${os.hostname()}:${process.pid}`;

  const finishAndNotify = async (runId: string, state: "failed", error: RunError) => {
    const run = await retrying("finish run", log, () => finishRun(db, runId, state, { error }));
    if (run) await notify(run);
  };
  const notify = async (run: Run) => {
    try {
      await notifyRunFinished(
        { db, log, mailer: deps.mailer, publicUrl: deps.publicUrl, notifyAfterSeconds: settings.notifyAfterSeconds },
        run,
      );
    } catch (err) {
      log.warn({ err: { message: (err as Error).message }, runId: run.id }, "run notification failed");
    }
  };
  const mergeAndNotify = async (runId: string) => {
    const run = await retrying("read run", log, () => getRun(db, runId));
    const kind = run && runKind(run.kind);
    if (!run || !kind || run.state !== "running") return;
    const params = kind.params.parse(run.params);
    let merge = (partials: unknown[]) => kind.merge(partials, params);
    if (kind.mergeTaskFile) {
      // A long merge runs in the pool before taking the run's lock; done shards never change, so its input is final.
      const shards = await retrying("read shards", log, () => shardsOf(db, runId));
      if (shards.some((s) => s.state !== "done")) return;
      let out: { ok: true; result: unknown } | { ok: false; error: RunError };
      try {
        out = await pool.run({ partials: shards.map((s) => s.partial), params } satisfies MergeTaskInput, {
          filename: kind.mergeTaskFile,
        });
      } catch (err) {
        const oom = (err as { code?: string }).code === "ERR_WORKER_OUT_OF_MEMORY";
        out = {
          ok: false,
          error: oom
            ? { code: "MEMORY_LIMIT", message: `Merging needed more than ${settings.workerMemoryMb} MB of memory` }
            : { code: "MERGE_FAILED", message: (err as Error).message },
        };
      }
      if (!out.ok) return finishAndNotify(runId, "failed", out.error);
      const merged = out.result;
      merge = () => merged;
    }
    const merged = await retrying("merge run", log, () => mergeRunOnce(db, runId, merge, kind.afterMerge));
    if (!merged) return;
    log.info({ runId }, "run succeeded");
    const finished = await getRun(db, runId);
    if (finished) await notify(finished);
  };

  async function handleJob(job: PgBoss.JobWithMetadata<ShardJobData>): Promise<void> {
    const { runId, shardId } = job.data;
    const run = await retrying("read run", log, () => getRun(db, runId));
    if (!run || isRunFinished(run.state)) return;
    const kind = runKind(run.kind);
    if (!kind)
      return finishAndNotify(runId, "failed", {
        code: "UNKNOWN_KIND",
        message: `This worker does not know run kind "${run.kind}"`,
      });
    const start = await retrying("start run", log, () => tryStartRun(db, runId, settings.projectConcurrency));
    if (start === "finished") return;
    if (start === "wait") {
      const next = await sendShardJob(boss, { runId, shardId }, WAIT_FOR_SLOT_SECONDS);
      await retrying("record job", log, () => setShardJob(db, shardId, next));
      return;
    }
    const lease = randomUUID();
    const shard = await retrying("claim shard", log, () =>
      claimShard(db, shardId, lease, job.id, settings.staleSeconds, workerName),
    );
    // Done already, or held by a live worker: this job is a duplicate and has nothing to do.
    if (!shard) return;
    await executeShard(run, kind, shard, lease, job);
  }

  async function executeShard(
    run: Run,
    kind: RunKindDefinition<unknown>,
    shard: Shard,
    lease: string,
    job: PgBoss.JobWithMetadata<ShardJobData>,
  ): Promise<void> {
    const stopFlag = new Int32Array(new SharedArrayBuffer(4));
    const stop = (reason: number) => Atomics.compareExchange(stopFlag, 0, StopReason.none, reason);
    const { port1, port2 } = new MessageChannel();
    const latest = { fraction: 0, phase: shard.claims > 1 ? "resuming" : "starting" };
    let checkpoint: { cursor: unknown; partial: unknown } | undefined;
    port1.on("message", (m: TaskMessage) => {
      latest.fraction = m.fraction;
      latest.phase = m.phase;
      if (m.type === "checkpoint") checkpoint = { cursor: m.cursor, partial: m.partial };
    });
    let flushing: Promise<void> | null = null;
    const flush = () => {
      flushing ??= (async () => {
        const cp = checkpoint;
        checkpoint = undefined;
        try {
          const held = await recordShardProgress(db, shard.id, lease, { ...latest, checkpoint: cp });
          if (!held) return void stop(StopReason.leaseLost);
          await refreshRunProgress(db, run.id, latest.phase);
          const st = await runState(db, run.id);
          if (!st || st.state !== "running") stop(StopReason.cancelled);
          else if (st.startedAt && st.now.getTime() - st.startedAt.getTime() > st.timeLimitSeconds * 1000)
            stop(StopReason.timeLimit);
        } catch (err) {
          // The database is away (restarting?): keep computing, and write this checkpoint next time unless a newer one came.
          checkpoint ??= cp;
          log.warn({ err: { message: (err as Error).message }, shardId: shard.id }, "heartbeat failed");
        } finally {
          flushing = null;
        }
      })();
      return flushing;
    };
    const timer = setInterval(() => void flush(), settings.heartbeatMs);
    stopFlags.add(stopFlag);
    let output: ShardTaskOutput | undefined;
    let thrown: unknown;
    try {
      output = await pool.run(
        { input: shard.input, cursor: shard.cursor, partial: shard.partial, port: port2, stopFlag },
        { filename: kind.taskFile, transferList: [port2] as never },
      );
    } catch (err) {
      thrown = err;
    } finally {
      clearInterval(timer);
      stopFlags.delete(stopFlag);
      port1.close();
    }
    const reason = Atomics.load(stopFlag, 0);
    if (reason === StopReason.cancelled || reason === StopReason.leaseLost) return;
    if (reason === StopReason.shutdown) {
      // Keep what was counted, then hand the shard to another worker right away.
      await flushing;
      if (checkpoint) await recordShardProgress(db, shard.id, lease, { ...latest, checkpoint }).catch(() => false);
      await releaseShard(db, shard.id, lease, false);
      const next = await sendShardJob(boss, { runId: run.id, shardId: shard.id });
      await setShardJob(db, shard.id, next);
      return;
    }
    if (reason === StopReason.timeLimit) {
      return finishAndNotify(run.id, "failed", {
        code: "TIME_LIMIT",
        message: `The run exceeded its time limit of ${Math.round(run.timeLimitSeconds / 60)} minutes`,
      });
    }
    if (thrown !== undefined) {
      const code = (thrown as { code?: string }).code;
      if (code === "ERR_WORKER_OUT_OF_MEMORY") {
        return finishAndNotify(run.id, "failed", {
          code: "MEMORY_LIMIT",
          message: `The computation needed more than ${settings.workerMemoryMb} MB of memory`,
        });
      }
      if (job.retryCount >= job.retryLimit) {
        return finishAndNotify(run.id, "failed", {
          code: "WORKER_ERROR",
          message: `A shard failed ${job.retryCount + 1} times: ${(thrown as Error).message}`,
        });
      }
      // pg-boss retries this job; give the shard back so the retry can claim it at once.
      await retrying("release shard", log, () => releaseShard(db, shard.id, lease, true));
      throw thrown;
    }
    if (!output) return;
    if (!output.ok) {
      if (output.error.code === "CANCELLED") return;
      return finishAndNotify(run.id, "failed", output.error);
    }
    const partial = output.partial;
    const completed = await retrying("complete shard", log, () => completeShard(db, shard.id, lease, partial));
    if (!completed) return;
    await retrying("run progress", log, () => refreshRunProgress(db, run.id, latest.phase));
    await mergeAndNotify(run.id);
  }

  let reaping = false;
  async function reap(): Promise<void> {
    if (reaping || stopping) return;
    reaping = true;
    try {
      for (const s of await staleShards(db, settings.staleSeconds)) {
        if (!(await requeueStaleShard(db, s.id, settings.staleSeconds))) continue;
        log.info({ shardId: s.id, runId: s.runId }, "re-queued a shard whose worker stopped responding");
        await setShardJob(db, s.id, await sendShardJob(boss, { runId: s.runId, shardId: s.id }));
      }
      for (const s of await shardsWithoutJob(db, Math.max(10, settings.staleSeconds))) {
        await setShardJob(db, s.id, await sendShardJob(boss, { runId: s.runId, shardId: s.id }));
      }
      for (const runId of await runsAwaitingMerge(db)) await mergeAndNotify(runId);
    } catch (err) {
      log.warn({ err: { message: (err as Error).message } }, "reaper pass failed");
    } finally {
      reaping = false;
    }
  }

  const track = (p: Promise<void>) => {
    handlers.add(p);
    void p.finally(() => handlers.delete(p)).catch(() => {});
    return p;
  };
  // One pg-boss poller per thread, each handling one job at a time, keeps every thread busy and no more.
  for (let i = 0; i < Math.max(1, settings.threads); i++) {
    let pollerId = "";
    pollerId = await boss.work<ShardJobData>(
      SHARD_QUEUE,
      { batchSize: 1, pollingIntervalSeconds: 0.5, includeMetadata: true },
      async ([job]) => {
        // pg-boss waits a polling interval after every fetch; while jobs keep coming, fetch the next one at once.
        if (!stopping) boss.notifyWorker(pollerId);
        return track(handleJob(job!));
      },
    );
  }
  const reaper = setInterval(() => void reap(), settings.reapEveryMs);
  log.info({ threads: settings.threads }, "run worker started");

  return {
    pool,
    async stop() {
      if (stopping) return;
      stopping = true;
      clearInterval(reaper);
      await boss.offWork(SHARD_QUEUE);
      for (const f of stopFlags) Atomics.compareExchange(f, 0, StopReason.none, StopReason.shutdown);
      await Promise.allSettled([...handlers]);
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
      await pool.destroy();
    },
  };
}
