// The sending side of the queue for the API process: started on the first send, so building the app opens no
// connection; stopped by main.ts on shutdown (and by tests through stopRunQueue).
import type PgBoss from "pg-boss";
import type { Logger } from "pino";
import { sendShardJob, startBoss, type ShardJobData } from "./boss";

export interface RunQueue {
  send(data: ShardJobData, startAfterSeconds?: number): Promise<string>;
  stop(): Promise<void>;
}

export function lazyRunQueue(databaseUrl: string, log: Logger): RunQueue {
  let starting: Promise<PgBoss> | null = null;
  return {
    async send(data, startAfterSeconds) {
      starting ??= startBoss(databaseUrl, log, { supervise: false }).catch((err) => {
        starting = null;
        throw err;
      });
      return sendShardJob(await starting, data, startAfterSeconds);
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
  return { send: (data, after) => sendShardJob(boss, data, after), stop: async () => {} };
}
