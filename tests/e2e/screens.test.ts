// A perturbation screen from the model page: a person chooses nodes and a phenotype, the `screen` run is done by a
// real in-process worker (as under `npm start`), and its rows read as a table ranked by basin share, also as CSV,
// or as a heatmap; a row or a cell opens the model under its perturbation, computed again in a Web Worker.
import fs from "node:fs/promises";
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { screenshot } from "../support/browser";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

const DEMO_PROJECT = "00000000-0000-4000-8000-000000000001";
const BLOOM = "00000000-0000-4000-8000-000000000301";

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

describe("screen heatmap and the model under one perturbation", () => {
  it("opens a pair screen of the demo bloom switch as a heatmap, walks it by keyboard and opens a cell and a row", async () => {
    const { page, server } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await page.setViewportSize({ width: 1280, height: 900 });
    await page.goto(`${server.baseUrl}/projects/${DEMO_PROJECT}/models/${BLOOM}`);
    const section = page.getByTestId("screen-section");
    for (const n of ["Light", "DrmK", "GlfB"]) await section.getByTestId(`screen-node-${n}`).click();
    await section.getByLabel("Phenotype").fill("Cyst=1");
    await section.getByText("also every pair").click();
    await section.getByTestId("start-screen").click();
    await section.getByTestId("screen-result").waitFor({ timeout: 90_000 });
    // 3 nodes: 6 single perturbations and 3 pairs of nodes with 4 value combinations each.
    expect(await section.getByTestId("screen-row").count()).toBe(18);
    expect(page.url()).toMatch(/[?&]screen=[0-9a-f-]{36}/);

    await section.getByRole("button", { name: "Heatmap" }).click();
    const heatmap = section.getByTestId("screen-heatmap");
    await heatmap.waitFor();
    // A 6 x 6 matrix over (node, direction): 6 cells hold one node both ways and are no perturbation.
    expect(await heatmap.locator("[data-cell]").count()).toBe(36);
    expect(await heatmap.locator('[data-status="impossible"]').count()).toBe(6);
    expect(await heatmap.getByTestId("heatmap-cell").count()).toBe(30);
    await expect.poll(() => heatmap.getByTestId("heatmap-legend").textContent()).toContain("100.0 %");
    await section.scrollIntoViewIfNeeded();
    await screenshot(page, "screen-heatmap-pairs");

    // One tab stop: the first cell (Light knocked out); the arrow keys walk to Light KO with DrmK KO.
    const first = heatmap.locator('[data-cell="0-0"]');
    await first.focus();
    await expect.poll(() => heatmap.getByTestId("heatmap-detail").textContent()).toMatch(/^Light knocked out: basin/);
    await page.keyboard.press("ArrowRight");
    await page.keyboard.press("ArrowRight");
    const focusedCell = heatmap.locator('[data-cell="0-2"]');
    expect(await focusedCell.evaluate((el) => el === document.activeElement)).toBe(true);
    expect(await heatmap.locator('[tabindex="0"]').count()).toBe(1);
    const detail = (await heatmap.getByTestId("heatmap-detail").textContent())!;
    expect(detail).toMatch(/^Light knocked out, GlfB knocked out: basin share with the phenotype \d+\.\d %/);
    const cellShare = /phenotype (\d+\.\d) %/.exec(detail)![1]!;
    await screenshot(page, "screen-heatmap-focused");
    await heatmap.screenshot({ path: new URL("./screenshots/screen-heatmap-close.png", import.meta.url).pathname });

    await page.keyboard.press("Enter");
    await page.getByTestId("perturbed-comparison").waitFor({ timeout: 60_000 });
    expect(page.url()).toContain("/perturbed?");
    expect(await page.getByTestId("perturbed-title").textContent()).toContain(
      "with Light knocked out, GlfB knocked out",
    );
    // The browser's own analysis of the perturbed model gives the share the screen run computed on the server.
    const summary = (await page.getByTestId("perturbed-summary").textContent())!;
    expect(summary).toContain("Every synchronous attractor with its exact basin (12 nodes, 4,096 states)");
    expect(summary).toContain(`Share of states ending with Cyst=1: `);
    expect(summary).toMatch(new RegExp(`→ ${cellShare.replace(".", "\\.")} %\\.`));
    const counts = /(\d+) kept, (\d+) lost, (\d+) gained/.exec(summary)!.slice(1).map(Number);
    for (const [id, n] of [
      ["attractors-kept", counts[0]],
      ["attractors-lost", counts[1]],
      ["attractors-gained", counts[2]],
    ] as const)
      expect(await page.getByTestId(id).getByTestId("compared-attractor").count()).toBe(n);
    await screenshot(page, "perturbed-from-heatmap");

    // The address alone opens the same view (a bookmark, a shared link).
    const address = page.url();
    await page.goto("about:blank");
    await page.goto(address);
    await page.getByTestId("perturbed-comparison").waitFor({ timeout: 60_000 });
    expect(await page.getByTestId("perturbed-summary").textContent()).toBe(summary);

    // Back on the model page the screen is still there; the first table row opens its perturbation.
    await page.getByRole("link", { name: /and its screen/ }).click();
    await section.getByTestId("screen-result").waitFor({ timeout: 30_000 });
    const firstRow = section.getByTestId("screen-row").first();
    const rowShare = /(\d+\.\d) %/.exec((await firstRow.textContent())!)![1]!;
    await firstRow.getByRole("link").click();
    await page.getByTestId("perturbed-comparison").waitFor({ timeout: 60_000 });
    expect(await page.getByTestId("perturbed-summary").textContent()).toMatch(
      new RegExp(`→ ${rowShare.replace(".", "\\.")} %\\.`),
    );
    await screenshot(page, "perturbed-from-row");

    // A perturbation of a node the model lacks is refused in words, naming the node.
    await page.goto(`${server.baseUrl}/projects/${DEMO_PROJECT}/models/${BLOOM}/perturbed?perturbation=Nope%3D0`);
    await expect.poll(() => page.getByRole("alert").textContent()).toContain("perturbation: Nope is not in this model");
    expect(errors).toEqual([]);
  });
});
