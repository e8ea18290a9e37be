// Reduce by elimination in the browser: on the 40-node cell cycle with a delay line (Faure, Naldi, Chaouiya and
// Thieffry, "Dynamical analysis of a generic Boolean model for the control of the mammalian cell cycle",
// Bioinformatics 2006, rules from memory) a person sees which nodes cannot be chosen and why, eliminates the delay
// line by a run, reads what the reduction preserves and saves the reduced model with its proposed reduction.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DELAY_LINE_LENGTH, FAURE_WITH_DELAY_LINE } from "../support/large-model-fixtures";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

let browser: BrowserSession;
let modelUrl: string;

beforeAll(async () => {
  browser = await openBrowserSession({ withWorker: true, signInAs: "owner@demo.emulant.test" });
  const { server } = browser;
  // A fresh project: a stored run of an earlier test would be shown instead of a new one.
  const created = await browser.context.request.post(server.baseUrl + "/api/projects", {
    data: { name: `Elimination in the browser ${randomUUID().slice(0, 6)}` },
  });
  const projectId = (await created.json()).data.id;
  const model = await browser.context.request.post(`${server.baseUrl}/api/projects/${projectId}/models`, {
    data: { name: "Cell cycle with delay line", ruleText: FAURE_WITH_DELAY_LINE },
  });
  expect(model.status()).toBe(201);
  modelUrl = `${server.baseUrl}/projects/${projectId}/models/${(await model.json()).data.model.id}`;
});

afterAll(() => browser?.close());

describe("reduce by elimination in the browser", () => {
  it("offers only nodes without self-regulation, eliminates the delay line and saves the reduced model", async () => {
    const { page } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await page.goto(modelUrl);
    const panel = page.getByTestId("elimination-panel");
    await panel.waitFor();
    await page.getByTestId("elimination-mode-nodes").check();
    // CycD is the model's input (CycD' = CycD): it regulates itself, so it cannot be chosen.
    const cycD = panel.locator('[data-node="CycD"]');
    expect(await cycD.isDisabled()).toBe(true);
    expect(await panel.getByText("(regulates itself)").count()).toBeGreaterThan(0);
    for (let k = DELAY_LINE_LENGTH; k >= 1; k--) await panel.locator(`[data-node="Out${k}"]`).check();
    await page.getByTestId("elimination-start").click();
    const summary = page.getByTestId("elimination-summary");
    await summary.waitFor({ timeout: 60_000 });
    expect(await summary.textContent()).toMatch(/^40 nodes → 10: eliminated Out30, Out29, /);
    expect(await page.getByTestId("elimination-preserves").textContent()).toMatch(/Fixed points, one to one/);
    expect(await page.getByTestId("elimination-rules").textContent()).toContain("CycB' =");
    await page.getByTestId("save-reduced-model-button").click();
    const saved = page.getByTestId("reduced-model-saved");
    await saved.waitFor();
    expect(await saved.textContent()).toMatch(/proposed reduction/);
    expect(errors).toEqual([]);
  });
});
