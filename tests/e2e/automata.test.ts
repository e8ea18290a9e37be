// The automata screens in headless Chromium: the K = 11 hierarchy is drawn by sigma, and a rule page shows its
// own diagram and a witness as two runs side by side that agree.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { screenshot } from "../support/browser";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

let browser: BrowserSession;
let server: BrowserSession["server"];

beforeAll(async () => {
  // a modeler of the demo project may also start the background run for large block sizes
  browser = await openBrowserSession({ signInAs: "modeler@demo.emulant.test" });
  server = browser.server;
});
afterAll(() => browser?.close());

/** Whether a canvas has at least two different pixel colours, i.e. something was drawn on it. */
async function canvasHasDrawing(selector: string): Promise<boolean> {
  return browser.page.evaluate((sel) => {
    const c = document.querySelector(sel) as HTMLCanvasElement | null;
    if (!c || c.width === 0) return false;
    const data = c.getContext("2d")!.getImageData(0, 0, c.width, c.height).data;
    for (let i = 4; i < data.length; i += 4)
      if (data[i] !== data[0] || data[i + 1] !== data[1] || data[i + 2] !== data[2]) return true;
    return false;
  }, selector);
}

describe("automata screens in headless Chromium", () => {
  it("the hierarchy page draws the K = 11 hierarchy with sigma and the help text", async () => {
    const { page } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await page.goto(server.baseUrl + "/automata?maxBlock=11");
    await expect.poll(() => page.getByTestId("hierarchy-graph").count(), { timeout: 60_000 }).toBe(1);
    const graph = page.getByTestId("hierarchy-graph");
    expect(Number(await graph.getAttribute("data-nodes"))).toBeGreaterThan(5);
    expect(Number(await graph.getAttribute("data-edges"))).toBeGreaterThan(5);
    // sigma renders into canvases inside the container
    await expect.poll(() => graph.locator("canvas").count()).toBeGreaterThan(1);
    await expect.poll(() => page.getByTestId("hierarchy-stats").textContent()).toContain("block sizes up to 11");
    await page.getByText("What is block emulation?").click();
    await expect
      .poll(() => page.getByTestId("block-emulation-help").textContent())
      .toContain("rule 18 emulates rule 90");
    await page.waitForTimeout(500);
    await screenshot(page, "automata-hierarchy");

    await page.getByTestId("filter-symmetry").uncheck();
    await page.getByTestId("filter-search").fill("110");
    await page.waitForTimeout(800);
    await screenshot(page, "automata-hierarchy-rules-search");
    expect(errors).toEqual([]);
  });

  it("the rule page shows the rule's diagram and a witness as side-by-side runs that agree", async () => {
    const { page } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await page.goto(server.baseUrl + "/automata/rules/18?maxBlock=11");
    await expect.poll(() => page.getByTestId("rule-title").textContent()).toBe("Rule 18");
    await expect
      .poll(() => page.getByTestId("emulates-list").getByRole("button", { name: /^90 / }).count(), { timeout: 60_000 })
      .toBe(1);
    await page.getByTestId("emulates-list").getByRole("button", { name: /^90 / }).click();
    await expect
      .poll(() => page.getByTestId("witness-verdict").textContent(), { timeout: 30_000 })
      .toBe("The independent verifier confirms it.");
    await expect
      .poll(() => page.getByTestId("witness-agreement").textContent())
      .toContain("decode, block by block, to the rows of rule 90");
    expect(await canvasHasDrawing('[data-testid="rule-diagram"]')).toBe(true);
    expect(await canvasHasDrawing('[data-testid="witness-target-run"]')).toBe(true);
    expect(await canvasHasDrawing('[data-testid="witness-source-run"]')).toBe(true);
    await screenshot(page, "automata-rule-18");
    expect(errors).toEqual([]);
  });

  it("above block size 11 the page offers a background run and follows it with a progress bar", async () => {
    const { page } = browser;
    await page.goto(server.baseUrl + "/automata?maxBlock=16");
    await expect.poll(() => page.getByTestId("hierarchy-not-computed").isVisible(), { timeout: 30_000 }).toBe(true);
    await page.getByRole("button", { name: "Compute block sizes up to 16 in the background" }).click();
    await expect
      .poll(() => page.getByTestId("hierarchy-run-progress").getAttribute("data-state"), { timeout: 30_000 })
      .toMatch(/queued|running/);
    expect(await page.getByRole("progressbar").count()).toBe(1);
    await screenshot(page, "automata-background-run");
    // no worker runs in this test: cancel the run so it does not hold a queue slot of the demo project
    const runs = await browser.context.request.get(
      server.baseUrl + "/api/projects/00000000-0000-4000-8000-000000000001/runs?kind=eca-hierarchy",
    );
    for (const run of (await runs.json()).data as { id: string; state: string }[]) {
      if (run.state === "queued" || run.state === "running") {
        await browser.context.request.post(
          server.baseUrl + `/api/projects/00000000-0000-4000-8000-000000000001/runs/${run.id}/cancel`,
        );
      }
    }
  });
});
