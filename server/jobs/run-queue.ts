// The sending side of the queue for the API process: started on the first send, so building the app opens no
// connection; stopped by main.ts on shutdown (and by tests through stopRunQueue).
import type PgBoss from "pg-boss";
import type { Logger } from "pino";
import type { Knex } from "knex";
import { setShardJob } from "../db/repositories/run-shards";
import { getRun, unfinishedRuns, unfinishedShardIds } from "../db/repositories/runs";
import { sendShardJob, startBoss, type ShardJobData } from "./boss";
import { runsAheadInProject, shardJobPriority } from "./queue-order";

export interface RunQueue {
  send(data: ShardJobData, startAfterSeconds?: number, priority?: number): Promise<string>;
  stop(): Promise<void>;
}

export function lazyRunQueue(databaseUrl: string, log: Logger): RunQueue {
  let starting: Promise<PgBoss> | null = null;
  return {
    async send(data, startAfterSeconds, priority) {
      starting ??= startBoss(databaseUrl, log, { supervise: false }).catch((err) => {
        starting = null;
        throw err;
      });
      return sendShardJob(await starting, data, startAfterSeconds, priority);
    },
    async stop() {
      if (!starting) return;
      const boss = await starting.catch(() => null);
      starting = null;
      await boss?.stop({ graceful: false, wait: true });
    },
  };
}

/** A queue over an already started pg-boss (the worker's own). */
export function bossRunQueue(boss: PgBoss): RunQueue {
  return { send: (data, after, priority) => sendShardJob(boss, data, after, priority), stop: async () => {} };
}

/**
 * Sends the shard jobs of a run with their priorities: the first shard of a run with nothing ahead in its project
 * jumps the queue (jobs/queue-order.ts). Also used to promote a project's next run once the one before it ends: the
 * job sent earlier stays queued and finds its shard taken, which the worker treats as a duplicate.
 */
export async function enqueueRunShards(db: Knex, queue: RunQueue, runId: string, shardIds: readonly string[]) {
  const run = await getRun(db, runId);
  if (!run) return;
  const ahead = runsAheadInProject(
    { id: run.id, projectId: run.projectId, createdAt: Date.parse(run.createdAt), state: "queued" },
    await unfinishedRuns(db, run.projectId),
  );
  for (const [i, shardId] of shardIds.entries()) {
    const jobId = await queue.send({ runId, shardId }, undefined, shardJobPriority(ahead, i));
    await setShardJob(db, shardId, jobId);
  }
}

/** After a run of the project ended: its oldest queued run, if nothing runs ahead of it, is sent again at the front. */
export async function promoteNextRun(db: Knex, queue: RunQueue, projectId: string): Promise<void> {
  const unfinished = await unfinishedRuns(db, projectId);
  const next = unfinished[0];
  if (!next || next.state !== "queued") return;
  const shardIds = await unfinishedShardIds(db, next.id);
  if (shardIds.length) await enqueueRunShards(db, queue, next.id, shardIds.slice(0, 1));
}
