// Results read in the browser as a person reads them: attractor and trajectory states as grids with the node names
// as headers, the step where a trajectory enters its attractor, CSV downloads, and reduction-search runs that say in
// words what they did not find, within which bounds, and (for a coarse-graining) the coarsest grouping that closes.
import fs from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { screenshot } from "../support/browser";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

const PROJECT = "00000000-0000-4000-8000-000000000001";
const BLOOM = "00000000-0000-4000-8000-000000000301";
const RING = "00000000-0000-4000-8000-000000000306";
const PULSE = "00000000-0000-4000-8000-000000000307";

let browser: BrowserSession;
let server: BrowserSession["server"];

beforeAll(async () => {
  browser = await openBrowserSession({ withWorker: true, signInAs: "modeler@demo.emulant.test" });
  server = browser.server;
});
afterAll(() => browser?.close());

async function startSearch(body: object): Promise<string> {
  const res = await browser.context.request.post(`${server.baseUrl}/api/projects/${PROJECT}/reductions/searches`, {
    data: body,
  });
  expect([200, 201]).toContain(res.status());
  return (await res.json()).data.id;
}

describe("result views in headless Chromium", () => {
  it("shows attractor and trajectory states as grids with node headers, marks the attractor entry and downloads CSV", async () => {
    const { page } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await page.goto(`${server.baseUrl}/projects/${PROJECT}/models/${BLOOM}`);
    const model = await browser.context.request.get(`${server.baseUrl}/api/projects/${PROJECT}/models/${BLOOM}`);
    const nodes: string[] = (await model.json()).data.revision.network.nodes;
    const headers = page.getByTestId("attractor-grid-header");
    await expect.poll(() => headers.count(), { timeout: 30_000 }).toBe(nodes.length);
    expect([...(await headers.allTextContents())].sort()).toEqual([...nodes].sort());

    // From the all-off state the synchronous trajectory runs into one of the listed attractors and says which.
    await page.getByTestId("trajectory-initial").fill("0".repeat(nodes.length));
    await page.getByTestId("trajectory-run").click();
    await expect
      .poll(() => page.getByTestId("trajectory-entry").textContent())
      .toMatch(/^Enters attractor \d+ \((fixed point|cycle of \d+)[^)]*\) at step \d+\.$/);
    const entryText = (await page.getByTestId("trajectory-entry").textContent())!;
    const step = Number(/at step (\d+)/.exec(entryText)![1]);
    const rows = page.getByTestId("trajectory-grid-row");
    expect(await rows.nth(step).getAttribute("data-tone")).toBe("entry");
    expect(await rows.nth(step).textContent()).toContain(`t=${step}`);
    expect(await page.getByTestId("trajectory-grid-header").allTextContents()).toHaveLength(nodes.length);
    await page.getByTestId("trajectory-section").scrollIntoViewIfNeeded();
    await screenshot(page, "result-views-trajectory");
    await page.getByTestId("trajectory-section").screenshot({ path: "tests/e2e/screenshots/trajectory-grid.png" });
    await page.getByTestId("attractors-section").screenshot({ path: "tests/e2e/screenshots/attractor-grid.png" });

    const [download] = await Promise.all([
      page.waitForEvent("download"),
      page.getByTestId("trajectory-grid-csv").click(),
    ]);
    expect(download.suggestedFilename()).toBe("Glimmerfin bloom switch-r2-trajectory.csv");
    const csv = fs.readFileSync((await download.path())!, "utf8").split("\r\n");
    expect(
      csv[0]!
        .split(",")
        .slice(1, 1 + nodes.length)
        .sort(),
    ).toEqual([...nodes].sort());
    expect(csv[1]!.startsWith("t=0,")).toBe(true);
    expect(errors).toEqual([]);
  });

  it("shows the structure of the three-gene tide ring: one negative circuit, sensitivity 1", async () => {
    const { page } = browser;
    await page.goto(`${server.baseUrl}/projects/${PROJECT}/models/${RING}`);
    // Common practice: a ring of three repressions is one negative feedback circuit; NOT has sensitivity 1.
    await expect
      .poll(() => page.getByTestId("circuit-summary").textContent(), { timeout: 30_000 })
      .toContain("1 circuit of length ≤ 8: 0 positive (can support several stable states), 1 negative");
    expect(await page.getByTestId("circuit-list").textContent()).toContain("Tk1 → Tk2 → Tk3 → Tk1");
    expect(await page.getByTestId("average-sensitivity").textContent()).toContain("Network average 1.000");
    await page.getByTestId("structure-section").scrollIntoViewIfNeeded();
    await screenshot(page, "result-views-structure");
    await page.getByTestId("structure-section").screenshot({ path: "tests/e2e/screenshots/structure-view.png" });

    // The NK ensemble of the ring's size beside it: the Derrida curve is drawn and the ensemble's attractors counted.
    await page.getByTestId("ensemble-n").fill("10");
    await page.getByTestId("ensemble-run").click();
    await expect.poll(() => page.getByTestId("derrida-plot").locator("polyline").count()).toBe(3);
    expect(await page.getByTestId("ensemble-summary").textContent()).toMatch(
      /The 20 networks have on average [\d.]+ attractors/,
    );
    await page.getByTestId("ensemble-section").screenshot({ path: "tests/e2e/screenshots/ensemble-view.png" });
  });

  it("says a block-emulation search found nothing, in words, with its bounds and that it was exhaustive", async () => {
    const { page } = browser;
    // One node cannot encode three with blocks of one node: nothing can be found.
    const runId = await startSearch({
      mode: "given-target",
      notion: "block-emulation",
      sourceModelId: PULSE,
      targetModelId: RING,
      maxBlock: 1,
      maxTime: 1,
    });
    await page.goto(`${server.baseUrl}/projects/${PROJECT}/runs/${runId}`);
    await expect
      .poll(() => page.getByTestId("search-nothing").textContent(), { timeout: 60_000 })
      .toBe("No block emulation with blocks ≤ 1 at t ≤ 1.");
    expect(await page.getByTestId("run-title").textContent()).toBe(
      "Block emulation of Glimmerfin tide ring (3 genes) r1 by Glimmerfin tide pulse (1 gene) r1",
    );
    expect(await page.getByTestId("search-bounds").textContent()).toContain("t ≤ 1");
    expect(await page.getByTestId("search-exhaustive").textContent()).toContain("Exhaustive within these bounds");
    await screenshot(page, "result-views-nothing-found");
    await page.getByTestId("run-result").screenshot({ path: "tests/e2e/screenshots/search-nothing-found.png" });
  });

  it("shows a non-closing coarse-graining's coarsest grouping with its dynamics and network, and saves it as a model", async () => {
    const { page } = browser;
    const runId = await startSearch({ mode: "coarse-grain", sourceModelId: RING, observe: ["Tk1"], time: 1 });
    await page.goto(`${server.baseUrl}/projects/${PROJECT}/runs/${runId}`);
    await expect
      .poll(() => page.getByTestId("search-nothing").textContent(), { timeout: 60_000 })
      .toContain("No coarse-graining onto Tk1 at t = 1");
    const size = (await page.getByTestId("coarsest-size").textContent())!;
    const groups = Number(/needs (\d+) groups/.exec(size)![1]);
    expect(groups).toBeGreaterThan(2);
    expect(await page.getByTestId("coarsest-dynamics").locator("tbody tr").count()).toBe(groups);
    const rules = (await page.getByTestId("coarsest-rules").textContent())!.trim().split("\n");
    expect(rules).toHaveLength(Math.ceil(Math.log2(groups)));
    await screenshot(page, "result-views-coarsest-grouping");
    await page.getByTestId("run-result").screenshot({ path: "tests/e2e/screenshots/coarsest-grouping.png" });
    await page.getByTestId("save-model").click();
    await expect.poll(() => page.getByTestId("saved-model").textContent()).toContain("Coarsest grouping of");
  });
});
