// The models screens in headless Chromium: import an SBML-qual file, see the wiring diagram and the attractor
// table, edit a rule (with an inline error first), and see revision 2 with its own attractors.
import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openBrowser, screenshot } from "../support/browser";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";
import { MULTIVALUED_SBML, REPRESSOR_RING_SBML } from "../support/model-fixtures";

const PROJECT = "00000000-0000-4000-8000-000000000001";

let browser: BrowserSession;
let server: BrowserSession["server"];

beforeAll(async () => {
  browser = await openBrowserSession({ signInAs: "modeler@demo.emulant.test" });
  server = browser.server;
});
afterAll(() => browser?.close());

describe("models screens in headless Chromium", () => {
  it("imports an SBML-qual file, shows its wiring and attractors, and a rule edit makes revision 2 with new attractors", async () => {
    const { page } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));

    await page.goto(`${server.baseUrl}/projects/${PROJECT}/models`);
    await expect.poll(() => page.getByTestId("models-table").isVisible(), { timeout: 30_000 }).toBe(true);
    await screenshot(page, "models-list");
    await page.getByTestId("new-model").click();
    await page.getByTestId("mode-upload").click();

    // A multi-valued file is refused with its reason shown, before anything is stored.
    await page
      .getByTestId("upload-input")
      .setInputFiles({ name: "multi.sbml", mimeType: "application/xml", buffer: Buffer.from(MULTIVALUED_SBML) });
    await expect.poll(() => page.getByTestId("parse-errors").textContent()).toContain("CI has maxLevel 2");
    await screenshot(page, "models-upload-error");

    await page
      .getByTestId("upload-input")
      .setInputFiles({ name: "ring.sbml", mimeType: "application/xml", buffer: Buffer.from(REPRESSOR_RING_SBML) });
    // Nothing is stored before the person has seen what the file holds.
    await expect.poll(() => page.getByTestId("preview-nodes").textContent()).toContain("LacI");
    await page.getByTestId("store-upload").click();
    await page.waitForURL(/\/models\/[0-9a-f-]{36}$/);
    await expect.poll(() => page.getByTestId("model-title").textContent()).toBe("Repressor ring");
    await expect.poll(() => page.getByTestId("wiring-diagram").getAttribute("data-nodes")).toBe("3");
    expect(await page.getByTestId("wiring-diagram").getAttribute("data-edges")).toBe("3");
    // sigma mounted its WebGL layers inside the diagram.
    await expect.poll(() => page.locator("[data-testid=wiring-diagram] canvas").count()).toBeGreaterThan(1);
    const table = page.getByTestId("attractor-table");
    await expect.poll(() => table.getAttribute("data-count"), { timeout: 30_000 }).toBe("2");
    // The odd repressor ring: a 6-cycle and the all-off/all-on 2-cycle, every state on a cycle.
    expect(await page.getByTestId("attractor-basin").allTextContents()).toEqual(["6", "2"]);
    await page.getByTestId("marker-LacI").click();
    await expect.poll(() => page.getByTestId("attractor-phenotype").allTextContents()).toEqual(["~", "~"]);
    await page.getByTestId("attractor-row").first().click();
    await page.getByTestId("trajectory-run").click();
    await expect.poll(() => page.getByTestId("trajectory-grid-row").count()).toBe(21);
    await page.getByTestId("wiring-diagram").scrollIntoViewIfNeeded();
    await page.mouse.move(0, 0);
    await screenshot(page, "models-detail-r1");
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("download-png").click()]);
    expect(download.suggestedFilename()).toBe("Repressor ring-r1.png");
    const png = fs.readFileSync((await download.path())!);
    expect(png.subarray(1, 4).toString("latin1")).toBe("PNG");
    fs.mkdirSync(path.resolve("tests/e2e/screenshots"), { recursive: true });
    fs.writeFileSync(path.resolve("tests/e2e/screenshots/models-diagram-download.png"), png);

    // An error in the editor is marked at its line before saving, and the text cannot be saved until it is fixed.
    const editor = page.getByTestId("rule-editor");
    await editor.fill("LacI' = !CI\nTetR' = LacI &\nCI' = !TetR\n");
    await expect.poll(() => page.locator("[data-testid=editor-error-line]").getAttribute("data-line")).toBe("2");
    await expect.poll(() => page.getByTestId("save-revision").isDisabled()).toBe(true);
    await screenshot(page, "models-editor-error");

    // TetR now follows LacI: the loop becomes positive, with two fixed points and two 3-cycles.
    await editor.fill("LacI' = !CI\nTetR' = LacI\nCI' = !TetR\n");
    await expect.poll(() => page.locator("[data-testid=editor-error-line]").count()).toBe(0);
    await expect.poll(() => page.getByTestId("live-node-count").textContent()).toContain("3 nodes");
    await page.getByTestId("save-revision").click();
    await expect.poll(() => page.getByTestId("revision-label").getAttribute("data-revision")).toBe("2");
    await expect.poll(() => table.getAttribute("data-count"), { timeout: 30_000 }).toBe("4");
    const kinds = await page.locator("[data-testid=attractor-row] td:nth-child(2)").allTextContents();
    expect(kinds.filter((k) => k === "fixed point")).toHaveLength(2);
    expect(await page.getByTestId("revision-row").count()).toBe(2);
    await screenshot(page, "models-detail-r2");
    expect(errors).toEqual([]);
  });

  it("creates a model from written rules and another from the ring generator", async () => {
    const { page } = browser;
    await page.goto(`${server.baseUrl}/projects/${PROJECT}/models/new`);
    await page.getByTestId("model-name").fill("Written pair");
    await page.getByTestId("rule-editor").fill("P' = !Q\nQ' = P\n");
    await expect.poll(() => page.getByTestId("live-node-count").textContent()).toContain("2 nodes");
    await screenshot(page, "models-new-write");
    await page.getByTestId("save-model").click();
    await page.waitForURL(/\/models\/[0-9a-f-]{36}$/);
    await expect.poll(() => page.getByTestId("model-title").textContent()).toBe("Written pair");
    // P -| Q -> P is a negative loop of two: one 4-cycle through all states (common practice).
    await expect.poll(() => page.getByTestId("attractor-basin").allTextContents()).toEqual(["4"]);

    await page.goto(`${server.baseUrl}/projects/${PROJECT}/models/new`);
    await page.getByTestId("mode-generate").click();
    await page.getByTestId("gen-rule").fill("90");
    await page.getByTestId("gen-cells").fill("6");
    await screenshot(page, "models-new-generate");
    await page.getByRole("button", { name: "Generate model" }).click();
    await page.waitForURL(/\/models\/[0-9a-f-]{36}$/);
    await expect.poll(() => page.getByTestId("model-title").textContent()).toBe("Rule 90 ring of 6");
    await expect.poll(() => page.getByTestId("wiring-diagram").getAttribute("data-nodes")).toBe("6");
  });

  it("offers a background run for the 24-node demo model and lays out its wiring", async () => {
    const { page } = browser;
    await page.goto(`${server.baseUrl}/projects/${PROJECT}/models/00000000-0000-4000-8000-000000000305`);
    await expect
      .poll(() => page.getByTestId("wiring-diagram").getAttribute("data-nodes"), { timeout: 30_000 })
      .toBe("24");
    await expect.poll(() => page.getByTestId("attractor-run-panel").isVisible()).toBe(true);
    expect(await page.getByTestId("start-attractor-run").isVisible()).toBe(true);
    await page.waitForTimeout(500);
    await screenshot(page, "models-large-before-search");
    await page.getByTestId("node-search").fill("Arr1");
    await page.waitForTimeout(800);
    await screenshot(page, "models-large");
  });

  it("hides the writing controls from a viewer", async () => {
    const viewer = await openBrowser();
    try {
      const res = await viewer.context.request.post(server.baseUrl + "/api/auth/sign-in", {
        data: { email: "viewer@demo.emulant.test", password: "demo-password" },
      });
      expect(res.status()).toBe(200);
      await viewer.page.goto(`${server.baseUrl}/projects/${PROJECT}/models/00000000-0000-4000-8000-000000000302`);
      await expect
        .poll(() => viewer.page.getByTestId("attractor-table").getAttribute("data-count"), { timeout: 30_000 })
        .toBe("12");
      expect(await viewer.page.getByTestId("rule-editor").count()).toBe(0);
      await viewer.page.goto(`${server.baseUrl}/projects/${PROJECT}/models`);
      await expect.poll(() => viewer.page.getByTestId("models-table").isVisible()).toBe(true);
      expect(await viewer.page.getByTestId("new-model").count()).toBe(0);
    } finally {
      await viewer.close();
    }
  });
});
