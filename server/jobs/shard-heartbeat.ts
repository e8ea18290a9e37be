// While a shard computes, its worker writes a heartbeat every few hundred milliseconds: the task's latest progress
// and checkpoint, under the shard's lease. The same write learns whether the shard should stop: the lease went to
// another worker, the run was cancelled or deleted, or it ran past its time limit.
import type { MessagePort } from "node:worker_threads";
import type { Knex } from "knex";
import type { Logger } from "pino";
import { recordShardProgress, type Shard } from "../db/repositories/run-shards";
import { refreshRunProgress, runState } from "../db/repositories/runs";
import { StopReason, type TaskMessage } from "../workers/task-protocol";

export interface ShardHeartbeat {
  /** The task's latest progress, as it reported it. */
  readonly latest: { fraction: number; phase: string };
  /** Stops the timer and closes the task's port (the task has ended). */
  stop(): void;
  /** Writes a checkpoint the timer had not written yet, so a shard handed back resumes from it. */
  saveLastCheckpoint(): Promise<void>;
}

export interface HeartbeatOptions {
  runId: string;
  shard: Shard;
  lease: string;
  /** The worker's end of the task's message port. */
  port: MessagePort;
  everyMs: number;
  /** Asks the task to stop; the first reason given wins. */
  requestStop(reason: StopReason): void;
}

export function startShardHeartbeat(deps: { db: Knex; log: Logger }, o: HeartbeatOptions): ShardHeartbeat {
  const { db, log } = deps;
  const latest = { fraction: 0, phase: o.shard.claims > 1 ? "resuming" : "starting" };
  let checkpoint: { cursor: unknown; partial: unknown } | undefined;
  o.port.on("message", (m: TaskMessage) => {
    latest.fraction = m.fraction;
    latest.phase = m.phase;
    if (m.type === "checkpoint") checkpoint = { cursor: m.cursor, partial: m.partial };
  });

  let flushing: Promise<void> | null = null;
  const beat = async () => {
    const cp = checkpoint;
    checkpoint = undefined;
    try {
      const held = await recordShardProgress(db, o.shard.id, o.lease, { ...latest, checkpoint: cp });
      if (!held) return o.requestStop(StopReason.leaseLost);
      await refreshRunProgress(db, o.runId, latest.phase);
      const st = await runState(db, o.runId);
      if (!st || st.state !== "running") o.requestStop(StopReason.cancelled);
      else if (st.startedAt && st.now.getTime() - st.startedAt.getTime() > st.timeLimitSeconds * 1000)
        o.requestStop(StopReason.timeLimit);
    } catch (err) {
      // The database is away (restarting?): keep computing, and write this checkpoint next time unless a newer one came.
      checkpoint ??= cp;
      log.warn({ err: { message: (err as Error).message }, shardId: o.shard.id }, "heartbeat failed");
    } finally {
      flushing = null;
    }
  };
  // One write at a time: a slow database must not pile up heartbeats.
  const timer = setInterval(() => void (flushing ??= beat()), o.everyMs);

  return {
    latest,
    stop() {
      clearInterval(timer);
      o.port.close();
    },
    async saveLastCheckpoint() {
      await flushing;
      if (checkpoint) await recordShardProgress(db, o.shard.id, o.lease, { ...latest, checkpoint }).catch(() => false);
    },
  };
}
