// Builds the real app against the test database (DATABASE_URL, set by scripts/test.sh) for supertest and browser tests.
import type { Server } from "node:http";
import type { AddressInfo } from "node:net";
import { createApp, type AppDeps } from "../../server/app";
import { loadConfig } from "../../server/config";
import { createDb, type Knex } from "../../server/db/knex";
import { createLogger } from "../../server/logger";
import { createFakeMailer } from "../../server/mail/mailer";
import { lazyRunQueue } from "../../server/jobs/run-queue";

export interface TestApp {
  app: ReturnType<typeof createApp>;
  db: Knex;
  close(): Promise<void>;
}

export function testConfig() {
  if (!process.env.DATABASE_URL) throw new Error("DATABASE_URL is not set: run the tests through `npm test`");
  return loadConfig({ ...process.env, NODE_ENV: "test", LOG_LEVEL: process.env.LOG_LEVEL ?? "warn", PORT: "0" });
}

/** Mail always goes to the local SMTP fake (started on the first message), whatever SMTP_URL says. */
/** Tests create many accounts from one address, so sign-up is limited only when a test asks for it. */
const generousSignUp = { windowMs: 60_000, perAddress: 100_000 };

export function buildTestApp(overrides: Pick<AppDeps, "signInLimits" | "signUpLimits" | "runQueue"> = {}): TestApp {
  const config = testConfig();
  const db = createDb(config.DATABASE_URL, 5);
  const log = createLogger(config);
  const mailer = createFakeMailer(db, log);
  // Run jobs go to pg-boss on the test database; the sender opens its connections only when a run is started.
  const runQueue = overrides.runQueue ?? lazyRunQueue(config.DATABASE_URL, log);
  const app = createApp({ db, log, config, mailer, signUpLimits: generousSignUp, ...overrides, runQueue });
  return {
    app,
    db,
    close: async () => {
      await runQueue.stop();
      await mailer.close();
      await db.destroy();
    },
  };
}

export interface RunningServer extends TestApp {
  baseUrl: string;
  server: Server;
}

/** Listens on an ephemeral loopback port; the browser tests load the built client from it. */
export async function startTestServer(): Promise<RunningServer> {
  const t = buildTestApp();
  const server = await new Promise<Server>((resolve) => {
    const s = t.app.listen(0, "127.0.0.1", () => resolve(s));
  });
  const { port } = server.address() as AddressInfo;
  return {
    ...t,
    server,
    baseUrl: `http://127.0.0.1:${port}`,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
      await t.close();
    },
  };
}
