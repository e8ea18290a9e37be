import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { screenshot } from "../support/browser";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

let browser: BrowserSession;
let server: BrowserSession["server"];

beforeAll(async () => {
  browser = await openBrowserSession();
  server = browser.server;
});
afterAll(() => browser?.close());

describe("application shell in headless Chromium", () => {
  it("renders the shell in the shipped Inter font and shows the database as up", async () => {
    const { page } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await page.goto(server.baseUrl + "/");
    await expect.poll(() => page.getByTestId("product-name").textContent()).toContain("Emulant");
    await expect.poll(() => page.getByTestId("health-badge").getAttribute("data-status")).toBe("up");
    // The font must be the bundled one: document.fonts reports it loaded without any network beyond our server.
    await page.evaluate(() => document.fonts.ready);
    const isInterLoaded = await page.evaluate(
      () =>
        document.fonts.check('16px "Inter Variable"') &&
        [...document.fonts].some((f) => f.family.includes("Inter Variable") && f.status === "loaded"),
    );
    expect(isInterLoaded).toBe(true);
    const family = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
    expect(family).toContain("Inter Variable");
    await screenshot(page, "shell");
    expect(errors).toEqual([]);
  });

  it("shows the not-found page for an unknown address", async () => {
    const { page } = browser;
    await page.goto(server.baseUrl + "/no/such/page");
    await expect.poll(() => page.getByTestId("not-found").isVisible()).toBe(true);
  });
});
