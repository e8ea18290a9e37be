// What most browser tests start from: the real app on an ephemeral port, headless Chromium, optionally an in-process
// run worker (as under `npm start`), and a signed-in demo user. `close()` tears down in reverse order.
import type { BrowserContext, Page } from "playwright-core";
import { loadRunSettings } from "../../server/jobs/run-settings";
import { startRunWorker, type RunWorker } from "../../server/jobs/run-worker";
import { createLogger } from "../../server/logger";
import { openBrowser } from "./browser";
import { startTestServer, testConfig, type RunningServer } from "./test-app";

export interface BrowserSession {
  server: RunningServer;
  context: BrowserContext;
  page: Page;
  /** Replaces the browser's session with one for this demo (or fixture) account. */
  signIn(email: string, password?: string): Promise<void>;
  close(): Promise<void>;
}

export async function openBrowserSession(
  opts: { signInAs?: string; withWorker?: boolean } = {},
): Promise<BrowserSession> {
  const server = await startTestServer();
  let worker: RunWorker | null = null;
  if (opts.withWorker) {
    const config = testConfig();
    worker = await startRunWorker({
      db: server.db,
      log: createLogger(config),
      databaseUrl: config.DATABASE_URL,
      mailer: null,
      publicUrl: server.baseUrl,
      settings: loadRunSettings({ RUN_HEARTBEAT_MS: "300" }, 2),
    });
  }
  const browser = await openBrowser();
  const signIn = async (email: string, password = "demo-password") => {
    await browser.context.clearCookies();
    const res = await browser.context.request.post(server.baseUrl + "/api/auth/sign-in", { data: { email, password } });
    if (res.status() !== 200) throw new Error(`sign-in as ${email} failed: ${res.status()}`);
  };
  if (opts.signInAs) await signIn(opts.signInAs);
  return {
    server,
    context: browser.context,
    page: browser.page,
    signIn,
    close: async () => {
      await browser.close();
      await worker?.stop();
      await server.close();
    },
  };
}
