// A person starts a sharded run in the browser, watches the progress bar move, cancels it, and sees it cancelled;
// the work is done by a real in-process worker on pg-boss, as under `npm start`.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { screenshot } from "../support/browser";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

let browser: BrowserSession;
let server: BrowserSession["server"];
let projectId: string;

beforeAll(async () => {
  browser = await openBrowserSession({ withWorker: true, signInAs: "owner@demo.emulant.test" });
  server = browser.server;
  // A fresh project: a stored result of an earlier test run would be reused instead of running.
  const created = await browser.context.request.post(server.baseUrl + "/api/projects", {
    data: { name: `Runs in the browser ${randomUUID().slice(0, 6)}` },
  });
  projectId = (await created.json()).data.id;
});

afterAll(() => browser?.close());

describe("runs in the browser", () => {
  it("starts a run, shows the progress bar moving with elapsed time, cancels it and shows it cancelled", async () => {
    const { page } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await page.goto(`${server.baseUrl}/projects/${projectId}/runs`);
    await page.getByTestId("start-run-form").waitFor();
    // The form opens on a real analysis; the demonstration kind is chosen on purpose.
    expect(await page.getByTestId("start-kind").inputValue()).toBe("attractors");
    await page.getByTestId("start-kind").selectOption("sleep-count");
    // 4 shards of 1500 items at 10 ms each: ~15 s of work on two threads, long enough to watch and cancel.
    await page.getByTestId("start-items").fill("6000");
    await page.getByTestId("start-shards").fill("4");
    await page.getByTestId("start-delay").fill("10");
    await page.getByTestId("start-run").click();
    await page.getByTestId("run-detail").waitFor();

    const fraction = async () => Number(await page.getByTestId("run-progress").getAttribute("data-fraction"));
    await expect.poll(fraction, { timeout: 20_000 }).toBeGreaterThan(0.02);
    const first = await fraction();
    await screenshot(page, "runs-progress-early");
    await expect.poll(fraction, { timeout: 20_000 }).toBeGreaterThan(first + 0.05);
    await expect.poll(() => page.getByTestId("run-state").getAttribute("data-state")).toBe("running");
    await expect
      .poll(() => page.getByTestId("run-times").textContent())
      .toMatch(/Elapsed \d+:\d\d · about \d+:\d\d left/);
    const bar = await page.getByRole("progressbar", { name: "Run progress" }).getAttribute("aria-valuenow");
    expect(Number(bar)).toBeGreaterThan(0);
    await screenshot(page, "runs-progress-moving");

    await page.getByTestId("cancel-run").click();
    await expect.poll(() => page.getByTestId("run-state").getAttribute("data-state")).toBe("cancelled");
    await expect.poll(() => page.getByText("Cancelled by").isVisible()).toBe(true);
    await expect.poll(() => page.getByTestId("retry-run").isVisible()).toBe(true);
    expect(await page.getByTestId("cancel-run").count()).toBe(0);
    await screenshot(page, "runs-cancelled");

    // The list shows it under the "cancelled" filter.
    await page.goto(`${server.baseUrl}/projects/${projectId}/runs?state=cancelled`);
    await expect.poll(() => page.getByTestId("runs-table").locator("[data-state=cancelled]").count()).toBe(1);
    await screenshot(page, "runs-list-cancelled");
    expect(errors).toEqual([]);
  });

  it("shows unread notifications on the header's bell, lists them when opened and marks them read", async () => {
    const { page } = browser;
    const owner = await server.db("users").where({ email: "owner@demo.emulant.test" }).first();
    const title = `Your sleep-count run finished (${randomUUID().slice(0, 6)})`;
    await server.db("notifications").insert({
      user_id: owner.id,
      kind: "run.succeeded",
      title,
      body: "The run you started finished after 2 min.",
      link: `/projects/${projectId}/runs`,
    });
    await page.goto(`${server.baseUrl}/projects/${projectId}/runs`);
    await expect
      .poll(async () => Number(await page.getByTestId("notification-count").textContent()))
      .toBeGreaterThanOrEqual(1);
    await page.getByTestId("notification-bell").click();
    await expect
      .poll(() => page.getByRole("dialog", { name: "Notifications" }).getByText(title).isVisible())
      .toBe(true);
    await screenshot(page, "runs-notifications");
    await expect.poll(() => page.getByTestId("notification-count").count()).toBe(0);
  });
});
