// Expectations on the model page: a person adds one through the form, the background check (a real in-process
// worker, as under `npm start`) fills the matrix cell of the revision, a later revision that breaks it is flagged,
// and the table downloads as CSV.
import fs from "node:fs/promises";
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

let browser: BrowserSession;
let projectId = "";
let modelId = "";

// Two mutually repressing genes: under synchronous update 01 and 10 are fixed points and 00/11 a 2-cycle
// (common practice: the textbook toggle switch). Silencing A leaves the single fixed point A=0, B=1.
const TOGGLE = "A' = !B\nB' = !A\n";
const A_SILENCED = "A' = 0\nB' = !A\n";

beforeAll(async () => {
  browser = await openBrowserSession({ withWorker: true, signInAs: "owner@demo.emulant.test" });
  const { server, context } = browser;
  const created = await context.request.post(server.baseUrl + "/api/projects", {
    data: { name: `Expectations in the browser ${randomUUID().slice(0, 6)}` },
  });
  projectId = (await created.json()).data.id;
  const model = await context.request.post(`${server.baseUrl}/api/projects/${projectId}/models`, {
    data: { name: "Toggle switch", ruleText: TOGGLE },
  });
  expect(model.status()).toBe(201);
  modelId = (await model.json()).data.model.id;
});

afterAll(() => browser?.close());

describe("expectations on the model page", () => {
  it("adds an expectation in the form, shows its check as a pass, flags the revision that breaks it, and downloads the CSV", async () => {
    const { page, server, context } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await page.goto(`${server.baseUrl}/projects/${projectId}/models/${modelId}`);
    const section = page.getByTestId("expectations-section");
    await section.getByText("No expectations yet").waitFor();

    await section.getByTestId("add-expectation").click();
    await section.getByLabel("Id", { exact: true }).fill("two-fixed-points");
    await section.getByLabel("Outcome").selectOption("fixed-point-count");
    await section.getByLabel("Count").fill("2");
    await section.getByLabel("Source").fill("common practice: the toggle switch");
    await section.getByTestId("save-expectation").click();

    const row = section.getByTestId("expectation-row");
    await row.waitFor();
    expect(await row.textContent()).toContain("fixed points exactly 2");
    const first = section.locator('[data-testid="matrix-cell"][data-revision="1"]');
    await first.waitFor({ timeout: 60_000 });
    expect(await first.getAttribute("data-status")).toBe("pass");
    expect(await first.textContent()).toBe("✓");
    await first.click();
    const detail = section.getByTestId("matrix-detail");
    expect(await detail.textContent()).toContain("two-fixed-points on r1: pass");

    // A new revision is checked on its own; with A silenced only one fixed point is left, so the expectation breaks.
    const revised = await context.request.post(
      `${server.baseUrl}/api/projects/${projectId}/models/${modelId}/revisions`,
      {
        data: { ruleText: A_SILENCED, message: "A silenced" },
      },
    );
    expect(revised.status()).toBe(201);
    await page.reload();
    const second = section.locator('[data-testid="matrix-cell"][data-revision="2"]');
    await second.waitFor({ timeout: 60_000 });
    expect(await second.getAttribute("data-status")).toBe("fail");
    expect(await second.textContent()).toBe("✗");
    expect(await section.getByTestId("matrix-breaks").textContent()).toContain(
      "1 break: an expectation that held before fails",
    );
    await second.click();
    expect(await detail.textContent()).toContain("two-fixed-points on r2: fail (broken by this revision)");

    const [download] = await Promise.all([
      page.waitForEvent("download"),
      section.getByRole("link", { name: "Download CSV" }).click(),
    ]);
    expect(download.suggestedFilename()).toBe("expectations.csv");
    const csv = await fs.readFile((await download.path())!, "utf8");
    // Lines starting with "#" are the format's comments (docs/expectations-csv.md).
    const [header, line] = csv
      .trim()
      .split(/\r?\n/)
      .filter((l) => !l.startsWith("#"));
    expect(header).toMatch(/^id,/);
    expect(line).toContain("two-fixed-points");
    expect(line).toContain("common practice: the toggle switch");
    expect(errors).toEqual([]);
  });
});
