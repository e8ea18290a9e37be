// Headless Debian Chromium driven by playwright-core, with the flags this sandbox needs (no network, running as root).
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";

export async function openBrowser(): Promise<{ context: BrowserContext; page: Page; close(): Promise<void> }> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), "emulant-chromium-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: "/usr/bin/chromium",
    headless: true,
    viewport: { width: 1280, height: 800 },
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Screenshots go to tests/e2e/screenshots (git-ignored) so a person can look at what the test saw. */
export async function screenshot(page: Page, name: string): Promise<void> {
  const dir = path.join(path.dirname(new URL(import.meta.url).pathname), "../e2e/screenshots");
  fs.mkdirSync(dir, { recursive: true });
  await page.screenshot({ path: path.join(dir, `${name}.png`), fullPage: true });
}
