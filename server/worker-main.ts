// `npm run worker`: a process that only executes runs. Start as many as you like, on this or other machines, with
// the same DATABASE_URL; they share the queue. WORKER_THREADS sets its thread count (default: one per core).
import { loadConfig } from "./config";
import { createDb } from "./db/knex";
import { loadRunSettings } from "./jobs/run-settings";
import { startRunWorker } from "./jobs/run-worker";
import { createLogger } from "./logger";
import { createMailer } from "./mail/mailer";

const config = loadConfig();
const log = createLogger(config);
const db = createDb(config.DATABASE_URL, 6);
const mailer = createMailer(config, db, log);
const settings = loadRunSettings(process.env, config.WORKER_THREADS || undefined);
const worker = await startRunWorker({
  db,
  log,
  databaseUrl: config.DATABASE_URL,
  mailer,
  publicUrl: config.publicUrl,
  settings,
});
process.stdout.write(`Emulant worker ${process.pid} is taking runs with ${settings.threads} thread(s)\n`);

let stopping = false;
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  log.info({ signal }, "worker shutting down");
  await worker.stop();
  await mailer.close();
  await db.destroy();
  process.exit(0);
}
process.on("SIGINT", () => void shutdown("SIGINT"));
process.on("SIGTERM", () => void shutdown("SIGTERM"));
