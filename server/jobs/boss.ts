// pg-boss in the product's own PostgreSQL: one queue of shard jobs. A job carries only ids; the run and shard
// rows hold everything else. pg-boss retries a job whose handler threw (e.g. during a database outage).
import PgBoss from "pg-boss";
import type { Logger } from "pino";

export const SHARD_QUEUE = "run-shard";

export interface ShardJobData {
  runId: string;
  shardId: string;
}

export async function startBoss(databaseUrl: string, log: Logger, opts: { supervise: boolean }): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: databaseUrl,
    schema: "pgboss",
    max: 4,
    supervise: opts.supervise,
    schedule: false,
  });
  // Without a listener an 'error' event would crash the process; during an outage pg-boss reports every failed poll.
  boss.on("error", (err) => log.warn({ err: { message: (err as Error).message } }, "job queue error"));
  await boss.start();
  await boss.createQueue(SHARD_QUEUE, {
    name: SHARD_QUEUE,
    retryLimit: 5,
    retryDelay: 2,
    retryBackoff: true,
    expireInSeconds: 6 * 3600,
  });
  return boss;
}

/** `priority`: higher is fetched first (see jobs/queue-order.ts); equal priorities go oldest first. */
export async function sendShardJob(
  boss: PgBoss,
  data: ShardJobData,
  startAfterSeconds?: number,
  priority = 0,
): Promise<string> {
  const id = await boss.send(SHARD_QUEUE, data, {
    ...(startAfterSeconds ? { startAfter: startAfterSeconds } : {}),
    ...(priority ? { priority } : {}),
  });
  if (!id) throw new Error(`The job queue refused a job for shard ${data.shardId}`);
  return id;
}

const transientCodes = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "EPIPE",
  "ETIMEDOUT",
  "57P01",
  "57P02",
  "57P03",
  "53300",
]);

/** Errors of a database that is away for a moment (restart, failover, full connection slots), not of our SQL. */
export function isTransientDatabaseError(err: unknown): boolean {
  const e = err as { code?: string; message?: string; name?: string };
  if (e?.code && (transientCodes.has(e.code) || e.code.startsWith("08"))) return true;
  return /Connection terminated|connection timeout|Timeout acquiring a connection|server closed the connection|terminating connection/i.test(
    e?.message ?? "",
  );
}

/** Retries a database step through a short outage (PostgreSQL restarting): up to ~60 s with backoff. */
export async function retrying<T>(what: string, log: Logger, fn: () => Promise<T>, maxWaitMs = 60_000): Promise<T> {
  const started = Date.now();
  let delayMs = 200;
  for (;;) {
    try {
      return await fn();
    } catch (err) {
      if (!isTransientDatabaseError(err) || Date.now() - started > maxWaitMs) throw err;
      log.warn({ err: { message: (err as Error).message }, what }, "database step failed, retrying");
      await new Promise((r) => setTimeout(r, delayMs));
      delayMs = Math.min(delayMs * 2, 3000);
    }
  }
}
