// A perturbation screen from the model page: a person chooses nodes and a phenotype, the `screen` run is done by a
// real in-process worker (as under `npm start`), and its rows read as a table ranked by basin share, also as CSV.
import fs from "node:fs/promises";
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

let browser: BrowserSession;
let modelUrl = "";

// Two mutually repressing genes (common practice: the textbook toggle switch). Under synchronous update, holding
// A on or B off leaves the single fixed point A=1, B=0, so every state ends with A on; holding A off or B on leaves
// only A=0, B=1 (worked out by hand from the two rules).
const TOGGLE = "A' = !B\nB' = !A\n";

beforeAll(async () => {
  browser = await openBrowserSession({ withWorker: true, signInAs: "owner@demo.emulant.test" });
  const { server, context } = browser;
  const created = await context.request.post(server.baseUrl + "/api/projects", {
    data: { name: `Screen in the browser ${randomUUID().slice(0, 6)}` },
  });
  const projectId = (await created.json()).data.id;
  const model = await context.request.post(`${server.baseUrl}/api/projects/${projectId}/models`, {
    data: { name: "Toggle switch", ruleText: TOGGLE },
  });
  expect(model.status()).toBe(201);
  modelUrl = `${server.baseUrl}/projects/${projectId}/models/${(await model.json()).data.model.id}`;
});

afterAll(() => browser?.close());

describe("perturbation screen on the model page", () => {
  it("screens single knock-outs and over-expressions and ranks them by the phenotype's basin share", async () => {
    const { page } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await page.goto(modelUrl);
    const section = page.getByTestId("screen-section");
    await section.getByTestId("screen-node-A").click();
    await section.getByTestId("screen-node-B").click();
    await section.getByLabel("Phenotype").fill("A=1");
    await section.getByTestId("start-screen").click();

    await section.getByTestId("screen-result").waitFor({ timeout: 60_000 });
    const rows = await section.getByTestId("screen-row").allTextContents();
    expect(rows).toHaveLength(4);
    const top = rows.slice(0, 2);
    expect(top.every((r) => r.includes("100.0 %"))).toBe(true);
    expect(top.some((r) => r.startsWith("A over-expressed"))).toBe(true);
    expect(top.some((r) => r.startsWith("B knocked out"))).toBe(true);
    const bottom = rows.slice(2);
    expect(bottom.every((r) => r.includes("0.0 %") && !r.includes("100.0 %"))).toBe(true);
    expect(bottom.some((r) => r.startsWith("A knocked out"))).toBe(true);
    expect(bottom.some((r) => r.startsWith("B over-expressed"))).toBe(true);

    const [download] = await Promise.all([
      page.waitForEvent("download"),
      section.getByRole("button", { name: "Download CSV" }).click(),
    ]);
    const csv = await fs.readFile((await download.path())!, "utf8");
    const lines = csv.trim().split(/\r?\n/);
    expect(lines[0]).toMatch(/^perturbation,basin_share,/);
    expect(lines).toHaveLength(5);
    expect(lines[1]).toMatch(/^(A=1|B=0),1,/);
    expect(errors).toEqual([]);
  });
});
