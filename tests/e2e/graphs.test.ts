// Every graph as a person sees it, in headless Chromium against the demo project: self-loops drawn and counted, two-way
// regulations on separate curves, the exports in the screen's colours, the model hierarchy laid out the same on every
// load with arrows pointing down, every automaton node labelled, nodes reachable and operable by keyboard, the skip
// link, the reduction pages on a 390 px wide phone without sideways scrolling, and a coarse-graining explained in words.
import fs from "node:fs";
import { XMLParser } from "fast-xml-parser";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { SIGN_COLOURS } from "../../src/components/graph/palette";
import { screenshot } from "../support/browser";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

const PROJECT = "00000000-0000-4000-8000-000000000001";
const DIVISION_CYCLE = "00000000-0000-4000-8000-000000000303";
const TIDE_PULSE = "00000000-0000-4000-8000-000000000307";

let browser: BrowserSession;
let base: string;
const errors: string[] = [];

beforeAll(async () => {
  browser = await openBrowserSession({ signInAs: "owner@demo.emulant.test", withWorker: true });
  base = browser.server.baseUrl;
  browser.page.on("pageerror", (e) => errors.push(e.message));
});
afterAll(() => browser?.close());

/** Painted pixels on the canvas sigma's self-loop layer draws on. */
const loopPixels = (page: Page, testId: string) =>
  page.evaluate((id) => {
    const canvas = document.querySelector<HTMLCanvasElement>(`[data-testid="${id}"] canvas.sigma-selfLoops`);
    if (!canvas) return -1;
    const data = canvas.getContext("2d")!.getImageData(0, 0, canvas.width, canvas.height).data;
    let painted = 0;
    for (let i = 3; i < data.length; i += 4) if (data[i]! > 0) painted++;
    return painted;
  }, testId);

async function download(page: Page, testId: string): Promise<{ name: string; bytes: Buffer }> {
  const [file] = await Promise.all([page.waitForEvent("download"), page.getByTestId(testId).click()]);
  return { name: file.suggestedFilename(), bytes: fs.readFileSync((await file.path())!) };
}

const asArray = <T>(v: T | T[] | undefined): T[] => (v === undefined ? [] : Array.isArray(v) ? v : [v]);

describe("graphs in the browser", () => {
  it("draws Pulse' = !Pulse as a self-loop, and lists it among the edges", async () => {
    const { page } = browser;
    await page.goto(`${base}/projects/${PROJECT}/models/${TIDE_PULSE}`);
    const diagram = page.getByTestId("wiring-diagram");
    await expect.poll(() => diagram.getAttribute("data-loops-drawn"), { timeout: 30_000 }).toBe("1");
    expect(await diagram.getAttribute("data-edges")).toBe("1");
    expect(await loopPixels(page, "wiring-diagram")).toBeGreaterThan(20);
    expect(await page.getByTestId("wiring-edge-list").locator("li").allTextContents()).toEqual([
      "Pulse represses itself",
    ]);
  });

  it("draws every regulation of a model with self-loops and two-way pairs, in the screen's colours in the export", async () => {
    const { page } = browser;
    const structure = (
      await (
        await browser.context.request.get(
          `${base}/api/projects/${PROJECT}/models/${DIVISION_CYCLE}/revisions/1/structure`,
        )
      ).json()
    ).data as { edges: { source: string; target: string; sign: keyof typeof SIGN_COLOURS }[] };
    const loops = structure.edges.filter((e) => e.source === e.target);
    const key = (s: string, t: string) => `${s}->${t}`;
    const all = new Set(structure.edges.map((e) => key(e.source, e.target)));
    const twoWay = structure.edges.filter((e) => e.source < e.target && all.has(key(e.target, e.source)));
    // the demo's division cycle has both: the check below would prove nothing otherwise
    expect(loops.length).toBeGreaterThan(0);
    expect(twoWay.length).toBeGreaterThan(0);

    await page.goto(`${base}/projects/${PROJECT}/models/${DIVISION_CYCLE}`);
    const diagram = page.getByTestId("wiring-diagram");
    await expect.poll(() => diagram.getAttribute("data-loops-drawn"), { timeout: 30_000 }).toBe(String(loops.length));
    expect(await diagram.getAttribute("data-edges")).toBe(String(structure.edges.length));
    expect(await diagram.getAttribute("data-labels-drawn")).toBe(await diagram.getAttribute("data-nodes"));
    expect(await page.getByTestId("wiring-edge-list").getAttribute("data-count")).toBe(String(structure.edges.length));
    await diagram.scrollIntoViewIfNeeded();
    await page.mouse.move(0, 0);
    await screenshot(page, "graphs-wiring-division-cycle");

    const svg = await download(page, "download-svg");
    expect(svg.name).toBe("Glimmerfin division cycle (threshold)-r1.svg");
    const doc = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "" }).parse(svg.bytes.toString("utf8"));
    const paths = asArray(doc.svg.g[0].path) as {
      d: string;
      stroke: string;
      "data-source": string;
      "data-target": string;
    }[];
    expect(paths).toHaveLength(structure.edges.length);
    const drawn = new Map(paths.map((p) => [key(p["data-source"], p["data-target"]), p] as const));
    for (const e of structure.edges) expect(drawn.get(key(e.source, e.target))!.stroke).toBe(SIGN_COLOURS[e.sign]);
    for (const e of twoWay) {
      const there = drawn.get(key(e.source, e.target))!.d;
      const back = drawn.get(key(e.target, e.source))!.d;
      // both bent (a quadratic curve each) and along different paths
      expect(there).toContain("Q");
      expect(back).toContain("Q");
      expect(there).not.toBe(back);
    }
    for (const e of loops) expect(drawn.get(key(e.source, e.source))!.d).toContain("C");
    const png = await download(page, "download-png");
    expect(png.name).toBe("Glimmerfin division cycle (threshold)-r1.png");
    expect(png.bytes.subarray(1, 4).toString("latin1")).toBe("PNG");
  });

  it("reaches a wiring node from the keyboard and pins its details with Enter", async () => {
    const { page } = browser;
    await page.goto(`${base}/projects/${PROJECT}/models/${TIDE_PULSE}`);
    await page.getByTestId("node-search").focus();
    // Tab on from the search field until the node's button has the focus
    for (let i = 0; i < 10; i++) {
      await page.keyboard.press("Tab");
      if ((await page.evaluate(() => document.activeElement?.getAttribute("data-node-id"))) === "Pulse") break;
    }
    expect(await page.evaluate(() => document.activeElement?.getAttribute("data-node-id"))).toBe("Pulse");
    const outline = await page.evaluate(() => getComputedStyle(document.activeElement!).outlineStyle);
    expect(outline).not.toBe("none");
    await page.keyboard.press("Enter");
    await expect.poll(() => page.getByTestId("node-details").textContent()).toContain("pinned");
    expect(await page.getByTestId("wiring-node-list").locator("[aria-pressed=true]").count()).toBe(1);
  });

  it("lays the model hierarchy out identically on two loads, arrows pointing down, and opens a model from the keyboard", async () => {
    const { page } = browser;
    const coordinates = async () => {
      await page.goto(`${base}/projects/${PROJECT}/hierarchy`);
      const graph = page.getByTestId("model-hierarchy-graph");
      await graph.waitFor();
      return graph.evaluate((svg) => {
        const nodes = Object.fromEntries(
          [...svg.querySelectorAll("circle[data-id]")].map((c) => [
            c.getAttribute("data-id"),
            [Number(c.getAttribute("cx")), Number(c.getAttribute("cy"))],
          ]),
        );
        const edges = [...svg.querySelectorAll("path[data-source]")].map((p) => [
          p.getAttribute("data-source"),
          p.getAttribute("data-target"),
        ]);
        return { nodes, edges };
      });
    };
    const first = await coordinates();
    await screenshot(page, "graphs-model-hierarchy");
    const second = await coordinates();
    expect(second).toEqual(first);
    expect(first.edges.length).toBeGreaterThan(0);
    for (const [s, t] of first.edges) expect(first.nodes[s!]![1]).toBeLessThan(first.nodes[t!]![1]);
    expect(await page.getByTestId("size-legend").textContent()).toContain("Dot size");

    // models are links inside the picture: Tab reaches one, a ring shows it, Enter opens it
    const link = page.locator("[data-testid=model-hierarchy-graph] a").first();
    const target = await link.getAttribute("data-node-id");
    await link.focus();
    await expect.poll(() => page.locator("[data-focus-ring]").count()).toBe(1);
    await page.keyboard.press("Enter");
    await page.waitForURL(`${base}/projects/${PROJECT}/models/${target}`);
  });

  it("labels every node of the automata hierarchy and opens a rule from the keyboard", async () => {
    const { page } = browser;
    await page.goto(`${base}/automata`);
    const graph = page.getByTestId("hierarchy-graph");
    await graph.waitFor({ timeout: 90_000 });
    await expect.poll(() => graph.getAttribute("data-labels-drawn"), { timeout: 30_000 }).not.toBeNull();
    const nodes = Number(await graph.getAttribute("data-nodes"));
    expect(nodes).toBeGreaterThan(20);
    expect(Number(await graph.getAttribute("data-labels-drawn"))).toBe(nodes);
    const listed = await page.getByTestId("hierarchy-node-lists").locator("button").count();
    expect(listed).toBe(nodes);
    expect(await page.getByTestId("hierarchy-edge-list").getAttribute("data-count")).toBe(
      await graph.getAttribute("data-edges"),
    );
    await graph.scrollIntoViewIfNeeded();
    await page.mouse.move(0, 0);
    await screenshot(page, "graphs-automata-hierarchy");

    const button = page.getByTestId("hierarchy-node-lists").locator("button").first();
    const label = (await button.textContent())!;
    await button.focus();
    await page.keyboard.press("Enter");
    await page.waitForURL(new RegExp(`/automata/rules/${label.split(" ")[0]}`));
  });

  it("offers a skip link as the first stop of Tab, which moves the focus to the content", async () => {
    const { page } = browser;
    await page.goto(`${base}/projects/${PROJECT}`);
    await page.getByTestId("project-name").waitFor();
    await page.keyboard.press("Tab");
    expect(await page.evaluate(() => document.activeElement?.getAttribute("data-testid"))).toBe("skip-link");
    const box = await page.getByTestId("skip-link").boundingBox();
    expect(box && box.width > 20 && box.height > 10 && box.y >= 0).toBe(true);
    expect(await page.getByTestId("skip-link").textContent()).toBe("Skip to content");
    await page.keyboard.press("Enter");
    expect(await page.evaluate(() => document.activeElement?.id)).toBe("main");
  });

  it("fits the reductions pages on a 390 px wide screen, with G's rules beside its diagram", async () => {
    const { page } = browser;
    const noSidewaysScroll = () => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);
    await page.setViewportSize({ width: 390, height: 844 });
    try {
      await page.goto(`${base}/projects/${PROJECT}/reductions`);
      await page.getByTestId("reductions-table").waitFor();
      expect(await noSidewaysScroll()).toBe(true);
      await page.getByTestId("reductions-table").getByRole("link").last().click();
      await page.getByTestId("reduction-detail").waitFor();
      const source = page.getByTestId("source-diagram");
      await expect
        .poll(() => source.getAttribute("data-labels-drawn"), { timeout: 30_000 })
        .toBe(await source.getAttribute("data-nodes"));
      expect(await noSidewaysScroll()).toBe(true);
      expect(await page.getByTestId("target-rules").textContent()).toMatch(/' = /);
      expect(await page.getByTestId("source-caption").textContent()).toContain("Source F");
      await screenshot(page, "graphs-reduction-390");
    } finally {
      await page.setViewportSize({ width: 1280, height: 800 });
    }
  });

  it("captions a coarse-graining as such and says in words what each observable reads", async () => {
    const { page, context } = browser;
    const api = `${base}/api/projects/${PROJECT}`;
    // A and B swap every step whatever C does, so observing A and B closes: G is the two-node swap
    const created = await context.request.post(`${api}/models`, {
      data: { name: `Swap with a passenger ${Date.now()}`, ruleText: "A' = B\nB' = A\nC' = A & C\n" },
    });
    expect(created.status()).toBe(201);
    const modelId = (await created.json()).data.model.id as string;
    const started = await context.request.post(`${api}/reductions/searches`, {
      data: { mode: "coarse-grain", sourceModelId: modelId, observe: ["A", "B"] },
    });
    expect(started.status(), await started.text()).toBeLessThan(300);
    const runId = (await started.json()).data.id as string;
    await expect
      .poll(async () => (await (await context.request.get(`${api}/runs/${runId}`)).json()).data.state, {
        timeout: 60_000,
      })
      .toBe("succeeded");
    const list = (await (await context.request.get(`${api}/reductions`)).json()).data as {
      id: string;
      notion: string;
      source: { modelId: string };
    }[];
    const found = list.find((r) => r.source.modelId === modelId && r.notion === "coarse-graining");
    expect(found).toBeDefined();
    await page.goto(`${base}/projects/${PROJECT}/reductions/${found!.id}`);
    await page.getByTestId("reduction-detail").waitFor();
    expect(await page.getByTestId("source-caption").textContent()).toContain("the observable that reads the node");
    const words = await page.getByTestId("observables-in-words").locator("li").allTextContents();
    expect(words).toHaveLength(2);
    for (const w of words) expect(w).toMatch(/^\S+ is 1 exactly when [AB] is 1 \(it copies [AB]\)$/);
    expect(await page.getByTestId("codeword-table").textContent()).toContain("In words");
    expect(await page.getByTestId("target-rules").textContent()).toMatch(/' = /);
    await screenshot(page, "graphs-coarse-graining");
    expect(errors).toEqual([]);
  });
});
