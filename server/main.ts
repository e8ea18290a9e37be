// The product's process: configuration, database pool, HTTP server, and a clean shutdown on signals.
import type { Server } from "node:http";
import { createApp } from "./app";
import { loadConfig } from "./config";
import { createDb } from "./db/knex";
import { createLogger } from "./logger";

const config = loadConfig();
const log = createLogger(config);
const db = createDb(config.DATABASE_URL);
const app = createApp({ db, log, config });

const server: Server = app.listen(config.PORT, config.HOST, () => {
  const url = `http://${config.HOST}:${config.PORT}`;
  process.stdout.write(
    `\nEmulant is serving on ${url}\n` +
      `Demo sign-in: owner@demo.emulant.test / demo-password (see README for the other demo accounts)\n\n`,
  );
});

let stopping = false;
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  log.info({ signal }, "shutting down");
  server.close();
  server.closeAllConnections();
  await db.destroy();
  process.exit(0);
}
process.on("SIGINT", () => void shutdown("SIGINT"));
process.on("SIGTERM", () => void shutdown("SIGTERM"));
