// The product's process: configuration, database pool, HTTP server, and a clean shutdown on signals.
import type { Server } from "node:http";
import { createApp } from "./app";
import { loadConfig } from "./config";
import { createDb } from "./db/knex";
import { createLogger } from "./logger";
import { createMailer } from "./mail/mailer";
import { lazyRunQueue } from "./jobs/run-queue";
import { loadRunSettings } from "./jobs/run-settings";
import { startRunWorker, type RunWorker } from "./jobs/run-worker";
import { closeInteractivePool } from "./workers/interactive-pool";

const config = loadConfig();
const log = createLogger(config);
const db = createDb(config.DATABASE_URL);
const mailer = createMailer(config, db, log);
// The local fake starts with the process, so the mailbox works from the first invitation on.
if (mailer.start) await mailer.start();
const runQueue = lazyRunQueue(config.DATABASE_URL, log);
const app = createApp({ db, log, config, mailer, runQueue });
// One in-process worker so runs work out of the box; WORKER_THREADS=0 leaves the work to `npm run worker` processes.
let runWorker: RunWorker | null = null;

const server: Server = app.listen(config.PORT, config.HOST, () => {
  const url = `http://${config.HOST}:${config.PORT}`;
  process.stdout.write(
    `\nEmulant is serving on ${url}\n` +
      `Demo sign-in: owner@demo.emulant.test / demo-password (see README for the other demo accounts)\n\n`,
  );
  if (config.WORKER_THREADS !== 0) {
    const settings = loadRunSettings(process.env, config.WORKER_THREADS);
    startRunWorker({ db, log, databaseUrl: config.DATABASE_URL, mailer, publicUrl: config.publicUrl, settings })
      .then((w) => {
        runWorker = w;
        if (stopping) void w.stop();
      })
      .catch((err) => log.error({ err }, "the in-process run worker did not start; runs wait for `npm run worker`"));
  }
});

let stopping = false;
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  log.info({ signal }, "shutting down");
  server.close();
  server.closeAllConnections();
  await runWorker?.stop();
  await runQueue.stop();
  await closeInteractivePool();
  await mailer.close();
  await db.destroy();
  process.exit(0);
}
process.on("SIGINT", () => void shutdown("SIGINT"));
process.on("SIGTERM", () => void shutdown("SIGTERM"));
