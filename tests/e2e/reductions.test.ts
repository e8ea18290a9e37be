// The reductions journey in the browser: a modeler runs a discover search on the demo tide clock (a repressor ring
// hidden in two-node blocks), opens the best reduction, sees F's diagram coloured by block and the two runs agreeing,
// saves the target as a model; a reviewer approves it and it appears in the project's model hierarchy.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { screenshot } from "../support/browser";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

const DEMO_PROJECT = "00000000-0000-4000-8000-000000000001";
const TIDE_CLOCK_MODEL = "00000000-0000-4000-8000-000000000302";

let browser: BrowserSession;
let server: BrowserSession["server"];
let projectId: string;
let searchRunUrl: string;

beforeAll(async () => {
  browser = await openBrowserSession({ withWorker: true });
  server = browser.server;
  // A fresh project owned by the demo owner, with the demo modeler and reviewer, and a copy of the tide clock, so no
  // stored search result or earlier decision from another test is reused.
  const { request } = browser.context;
  await browser.signIn("owner@demo.emulant.test");
  const tide = await (
    await request.get(`${server.baseUrl}/api/projects/${DEMO_PROJECT}/models/${TIDE_CLOCK_MODEL}`)
  ).json();
  projectId = (
    await (
      await request.post(server.baseUrl + "/api/projects", {
        data: { name: `Reductions in the browser ${randomUUID().slice(0, 6)}` },
      })
    ).json()
  ).data.id;
  for (const [email, role] of [
    ["modeler@demo.emulant.test", "modeler"],
    ["reviewer@demo.emulant.test", "reviewer"],
  ] as const) {
    const user = await server.db("users").where({ email }).first("id");
    await server.db("memberships").insert({ project_id: projectId, user_id: user.id, role });
  }
  await browser.signIn("modeler@demo.emulant.test");
  const created = await request.post(`${server.baseUrl}/api/projects/${projectId}/models`, {
    data: { name: "Tide clock (copy)", ruleText: tide.data.revision.ruleText },
  });
  if (created.status() !== 201) throw new Error(`model copy failed: ${created.status()}`);
});

afterAll(() => browser?.close());

describe("reductions in the browser", () => {
  it("discovers, shows, saves, approves and draws a reduction", async () => {
    const { page } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));

    await page.goto(`${server.baseUrl}/projects/${projectId}/reductions`);
    await page.getByTestId("search-form").waitFor();
    await page.getByTestId("mode-discover").click();
    await page.getByTestId("max-target-nodes").fill("3");
    await page.getByTestId("max-block").fill("2");
    await screenshot(page, "reductions-search-form");
    await page.getByTestId("start-search").click();
    await page.getByTestId("search-started").waitFor();
    await page.getByTestId("search-started").getByRole("link").click();
    await expect
      .poll(() => page.getByTestId("run-state").getAttribute("data-state"), { timeout: 60_000 })
      .toBe("succeeded");

    searchRunUrl = page.url();

    await page.goto(`${server.baseUrl}/projects/${projectId}/reductions`);
    await page.getByTestId("reductions-table").waitFor();
    await page.getByTestId("reductions-table").getByRole("link").first().click();
    await page.getByTestId("reduction-detail").waitFor();
    await page.locator('[data-testid="source-diagram"] canvas').first().waitFor();
    expect(await page.getByTestId("codeword-table").textContent()).toContain("Tk1a");
    await expect.poll(() => page.getByTestId("paired-trajectories").getAttribute("data-agrees")).toBe("true");
    await expect.poll(() => page.getByTestId("review-state").textContent()).toBe("proposed");
    await page.getByTestId("save-target-name").fill("Tide ring");
    await page.getByTestId("save-target").getByRole("button").click();
    await page.getByTestId("save-target").waitFor({ state: "detached" });
    await screenshot(page, "reductions-detail");
    const reductionUrl = page.url();

    // The modeler sees no decision buttons; the reviewer does.
    expect(await page.getByTestId("approve").count()).toBe(0);
    await browser.signIn("reviewer@demo.emulant.test");
    await page.goto(reductionUrl);
    await page.getByTestId("approve").click();
    await expect.poll(() => page.getByTestId("review-state").textContent()).toBe("approved");
    await screenshot(page, "reductions-approved");

    await page.goto(`${server.baseUrl}/projects/${projectId}/hierarchy`);
    await expect.poll(() => page.getByTestId("model-hierarchy").getAttribute("data-edges")).toBe("1");
    await page.locator('[data-testid="model-hierarchy-graph"] circle').first().waitFor();
    await screenshot(page, "reductions-model-hierarchy");
    expect(errors).toEqual([]);
  });

  it("lists the search's ranked findings on its run page and proposes a held-back one from there", async () => {
    const { page } = browser;
    await browser.signIn("modeler@demo.emulant.test");
    await page.goto(searchRunUrl);
    await page.getByTestId("search-findings").waitFor();
    const rows = page.getByTestId("finding-row");
    const propose = page.getByTestId("propose-finding");
    const inReview = page.getByTestId("search-findings").getByRole("link", { name: "In review" });
    expect(await rows.count()).toBeGreaterThan(0);
    // The ten best enter review by themselves; the uninformative ones wait for a modeler.
    const heldBack = await propose.count();
    expect(heldBack).toBeGreaterThan(0);
    const reviewedBefore = await inReview.count();
    expect(reviewedBefore + heldBack).toBe(await rows.count());
    await propose.first().click();
    await expect.poll(() => propose.count()).toBe(heldBack - 1);
    expect(await inReview.count()).toBe(reviewedBefore + 1);
    await screenshot(page, "reductions-run-findings");
  });
});
