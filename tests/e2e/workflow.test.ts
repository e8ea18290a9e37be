// The review workflow in headless Chromium: a reviewer works through the queue with one bulk rejection (a reason is
// required), the proposer is told in the app and by e-mail (the local mail fake), a member named with @ in a comment
// is told, reviewers are told that a new reduction waits; a modeler leaving unsaved rule edits is warned and finds
// the draft again.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { blockEmulationCertificate } from "@shared/engine/certificates";
import { searchBlockEmulation } from "@shared/engine/emulation";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { screenshot } from "../support/browser";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

// The worked example of the README: F (a 4-cycle) emulates G (X' = !X) at t = 2; F0 (two copies of F) emulates F.
const rules = {
  F0: "P1' = !Q1\nP2' = !Q2\nQ1' = P1\nQ2' = P2\n",
  F: "P' = !Q\nQ' = P\n",
  G: "X' = !X\n",
};
const network = (text: string) => compileDefinition(readRuleText(text));
function certificate(source: string, target: string, maxTime: number) {
  const r = searchBlockEmulation(network(source), network(target), { maxTime, maxBlock: 4 });
  if (!r.witness) throw new Error("expected a witness");
  return blockEmulationCertificate(network(source), network(target), r.witness);
}

let browser: BrowserSession;
let server: BrowserSession["server"];
let projectId = "";
const modelIds: Record<string, string> = {};
const tag = randomUUID().slice(0, 6);

async function api(method: "get" | "post" | "patch", path: string, data?: object) {
  const res = await browser.context.request[method](`${server.baseUrl}/api${path}`, data ? { data } : undefined);
  if (res.status() >= 300) throw new Error(`${method} ${path}: ${res.status()} ${await res.text()}`);
  return (await res.json()).data;
}

async function upload(source: keyof typeof rules, target: keyof typeof rules, time: number) {
  return api("post", `/projects/${projectId}/reductions`, {
    sourceModelId: modelIds[source],
    targetModelId: modelIds[target],
    certificate: certificate(rules[source], rules[target], time),
  });
}

async function mailCount(email: string, subject: string): Promise<number> {
  const rows = await server
    .db("mail_messages")
    .whereRaw("? = any(mail_to)", [email])
    .andWhere("subject", "like", `%${subject}%`)
    .andWhere("text_body", "like", `%${tag}%`);
  return rows.length;
}

beforeAll(async () => {
  browser = await openBrowserSession();
  server = browser.server;
  await browser.signIn("owner@demo.emulant.test");
  projectId = (await api("post", "/projects", { name: `Review workflow ${tag}` })).id;
  for (const [email, role] of [
    ["modeler@demo.emulant.test", "modeler"],
    ["reviewer@demo.emulant.test", "reviewer"],
  ] as const) {
    const user = await server.db("users").where({ email }).first("id");
    await server.db("memberships").insert({ project_id: projectId, user_id: user.id, role });
  }
  await browser.signIn("reviewer@demo.emulant.test");
  await api("patch", "/notifications/preferences", {
    emailOnDecision: true,
    emailOnReviewWaiting: true,
    emailOnMention: true,
  });
  await browser.signIn("modeler@demo.emulant.test");
  await api("patch", "/notifications/preferences", {
    emailOnDecision: true,
    emailOnReviewWaiting: false,
    emailOnMention: true,
  });
  for (const [key, ruleText] of Object.entries(rules)) {
    modelIds[key] = (await api("post", `/projects/${projectId}/models`, { name: `${key} ${tag}`, ruleText })).model.id;
  }
  await upload("F", "G", 2);
  await upload("F0", "F", 1);
});
afterAll(() => browser?.close());

describe("the review workflow in the browser", () => {
  it("tells reviewers that reductions wait, in the app and by e-mail as they chose", async () => {
    await browser.signIn("reviewer@demo.emulant.test");
    const { page } = browser;
    await page.goto(`${server.baseUrl}/projects/${projectId}/reductions`);
    await page.getByTestId("notification-bell").click();
    await expect
      .poll(() => page.getByRole("dialog", { name: "Notifications" }).textContent())
      .toContain("A reduction waits for your review");
    await page.keyboard.press("Escape");
    const reviewerMail = await server
      .db("mail_messages")
      .whereRaw("? = any(mail_to)", ["reviewer@demo.emulant.test"])
      .andWhere("subject", "like", "%waits for your review%")
      .andWhere("text_body", "like", "%submitted a certificate%");
    expect(reviewerMail.length).toBeGreaterThanOrEqual(2);
  });

  it("lets a reviewer reject both waiting reductions at once, only with a reason", async () => {
    const { page } = browser;
    await page.goto(`${server.baseUrl}/projects/${projectId}/reductions`);
    await expect.poll(() => page.getByTestId("reduction-row").count()).toBe(2);
    await page.getByTestId("select-all").check();
    await expect.poll(() => page.getByTestId("selected-count").textContent()).toBe("2 reductions selected");
    expect(await page.getByTestId("bulk-reject").isDisabled()).toBe(true);
    await page.getByTestId("bulk-reason").fill(`Out of scope for this study ${tag}`);
    await screenshot(page, "review-queue-bulk");
    await page.getByTestId("bulk-reject").click();
    await expect.poll(() => page.getByTestId("bulk-outcome").textContent()).toContain("2 reductions decided");
    // The queue shows what still waits: nothing.
    await page.getByTestId("no-reductions").waitFor();
    // Rejected ones are one filter away.
    await page.getByLabel("Review state").selectOption("rejected");
    await expect.poll(() => page.getByTestId("reduction-row").count()).toBe(2);
  });

  it("tells the proposer of the rejection in the app and by e-mail", async () => {
    await browser.signIn("modeler@demo.emulant.test");
    const { page } = browser;
    await page.goto(`${server.baseUrl}/projects/${projectId}`);
    await expect.poll(() => page.getByTestId("notification-count").isVisible()).toBe(true);
    await page.getByTestId("notification-bell").click();
    const panel = page.getByRole("dialog", { name: "Notifications" });
    await expect.poll(() => panel.textContent()).toContain("2 of your reductions were rejected");
    expect(await panel.textContent()).toContain(`Out of scope for this study ${tag}`);
    await expect.poll(() => mailCount("modeler@demo.emulant.test", "2 of your reductions were rejected")).toBe(1);
  });

  it("tells a member named with @ in a comment, in the app and by e-mail", async () => {
    await browser.signIn("reviewer@demo.emulant.test");
    const { page } = browser;
    const [reduction] = await api("get", `/projects/${projectId}/reductions`);
    await page.goto(`${server.baseUrl}/projects/${projectId}/reductions/${reduction.id}`);
    await page.getByTestId("comment-body").fill(`@Mira Castellan the codewords look odd ${tag}`);
    await page.getByRole("button", { name: "Post comment" }).click();
    await expect.poll(() => page.getByTestId("comments").textContent()).toContain(tag);
    await expect.poll(() => mailCount("modeler@demo.emulant.test", "Rowan Ashdown mentioned you")).toBe(1);
    await browser.signIn("modeler@demo.emulant.test");
    await page.goto(`${server.baseUrl}/projects/${projectId}`);
    await page.getByTestId("notification-bell").click();
    await expect
      .poll(() => page.getByRole("dialog", { name: "Notifications" }).textContent())
      .toContain("Rowan Ashdown mentioned you");
  });

  it("offers the existing model when the same content is uploaded again, after a preview of the file", async () => {
    const { page } = browser;
    await page.goto(`${server.baseUrl}/projects/${projectId}/models/new`);
    await page.getByTestId("mode-upload").click();
    await page
      .getByTestId("upload-input")
      .setInputFiles({ name: "oscillator.rules", mimeType: "text/plain", buffer: Buffer.from(rules.G) });
    await page.getByTestId("upload-preview").waitFor();
    expect(await page.getByTestId("upload-preview").textContent()).toContain("1 node,");
    expect(await page.getByTestId("duplicate-offer").textContent()).toContain(`G ${tag}`);
    await screenshot(page, "upload-duplicate-offer");
    await page.getByTestId("duplicate-open").click();
    await page.waitForURL(new RegExp(`/models/${modelIds.G}$`));
    const models = await api("get", `/projects/${projectId}/models`);
    expect(models).toHaveLength(3);
  });

  it("warns before leaving unsaved rule edits, and keeps them as a draft", async () => {
    const { page } = browser;
    await page.goto(`${server.baseUrl}/projects/${projectId}/models/${modelIds.G}`);
    const editor = page.getByLabel("Rule text");
    await page.getByTestId("save-revision").waitFor();
    await editor.fill(`X' = !X & \n`);
    // Text with an error cannot be saved.
    await expect.poll(() => page.getByTestId("save-revision").isDisabled()).toBe(true);
    await editor.fill(`X' = X\n# kept as a draft ${tag}\n`);
    await expect.poll(() => page.getByTestId("save-revision").isEnabled()).toBe(true);
    await page.getByRole("link", { name: "Models" }).first().click();
    await page.getByTestId("unsaved-warning").waitFor();
    await screenshot(page, "unsaved-edits-warning");
    await page.getByTestId("stay").click();
    expect(await editor.inputValue()).toContain(tag);
    await page.getByRole("link", { name: "Models" }).first().click();
    await page.getByTestId("leave").click();
    await page.waitForURL(/\/models$/);
    await page.goto(`${server.baseUrl}/projects/${projectId}/models/${modelIds.G}`);
    await page.getByTestId("draft-restored").waitFor();
    expect(await page.getByLabel("Rule text").inputValue()).toContain(tag);
  });
});
