// A 40-node model in the browser: the model page names the next step by size (SAT, not state enumeration),
// a person starts the trap-space search there, and the result reads in words; the work is done by a real
// in-process worker on pg-boss, as under `npm start`.
import { randomUUID } from "node:crypto";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DELAY_LINE_LENGTH, FAURE_WITH_DELAY_LINE } from "../support/large-model-fixtures";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

let browser: BrowserSession;
let server: BrowserSession["server"];
let modelUrl: string;

beforeAll(async () => {
  browser = await openBrowserSession({ withWorker: true, signInAs: "owner@demo.emulant.test" });
  server = browser.server;
  // A fresh project: a stored result of an earlier test run would be reused instead of running.
  const created = await browser.context.request.post(server.baseUrl + "/api/projects", {
    data: { name: `Large model in the browser ${randomUUID().slice(0, 6)}` },
  });
  const projectId = (await created.json()).data.id;
  const model = await browser.context.request.post(`${server.baseUrl}/api/projects/${projectId}/models`, {
    data: { name: "Cell cycle with delay line", ruleText: FAURE_WITH_DELAY_LINE },
  });
  expect(model.status()).toBe(201);
  modelUrl = `${server.baseUrl}/projects/${projectId}/models/${(await model.json()).data.model.id}`;
});

afterAll(() => browser?.close());

describe("a 40-node model in the browser", () => {
  it("names SAT and trap spaces as the next step, runs the trap-space search and tells the result in words", async () => {
    const { page } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await page.goto(modelUrl);
    const nextStep = page.getByTestId("next-step-text");
    await nextStep.waitFor();
    const nodes = 10 + DELAY_LINE_LENGTH;
    expect(await nextStep.textContent()).toContain(
      `With ${nodes} nodes (2^${nodes} states) no state space can be walked`,
    );
    expect(await nextStep.textContent()).toContain("Next step: fixed points and cycles by SAT and trap spaces by SAT.");
    // The two recommended methods carry the badge; the asynchronous one, beyond its exact size, does not.
    expect(await page.getByTestId("trap-spaces").getByText("next step", { exact: true }).count()).toBe(1);
    expect(await page.getByTestId("sat-cycles").getByText("next step", { exact: true }).count()).toBe(1);
    expect(await page.getByTestId("async-attractors").getByText("next step", { exact: true }).count()).toBe(0);

    await page.getByTestId("trap-spaces-start").click();
    const summary = page.getByTestId("trap-spaces-summary");
    await summary.waitFor({ timeout: 60_000 });
    // Faure, Naldi, Chaouiya and Thieffry, "Dynamical analysis of a generic Boolean model for the control of the
    // mammalian cell cycle", Bioinformatics 2006 (from memory): one stable state and one cyclic attractor, here the
    // trap space with CycD on and Rb and p27 off; the delay line copies CycB and adds no attractor.
    expect(await summary.textContent()).toMatch(
      /^2 minimal trap spaces, 1 of them fixed point\. The list is complete: there are no other minimal trap spaces\./,
    );
    const rows = await page.getByTestId("trap-space-row").allTextContents();
    expect(rows).toHaveLength(2);
    expect(rows).toContain("A fixed point (every node fixed).");
    expect(rows).toContain(`Fixes 3 of ${nodes} nodes, leaves ${nodes - 3} free: CycD = 1, Rb = 0, p27 = 0.`);

    await page.getByTestId("analyses-section").scrollIntoViewIfNeeded();
    await page
      .getByTestId("analyses-section")
      .screenshot({ path: path.join(import.meta.dirname, "../../docs/screens/large-model.png") });
    expect(errors).toEqual([]);
  });
});
