// Notifications through the API against the real database and the local mail fake: the proposer hears of a decision,
// reviewers hear that something waits, a person named with @ hears of the comment; in the app always, by e-mail as
// each person chose on their profile.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { blockEmulationCertificate } from "@shared/engine/certificates";
import { searchBlockEmulation } from "@shared/engine/emulation";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { signInAs, type Agent } from "../support/sessions";
import { buildTestApp } from "../support/test-app";

const t = buildTestApp();
const DEMO_PROJECT = "00000000-0000-4000-8000-000000000001";
const base = `/api/projects/${DEMO_PROJECT}`;
const suffix = Date.now().toString(36);
// The worked example of the README: a 4-cycle emulates X' = !X at t = 2 with the block {P, Q} and codewords 00/11.
const sourceRules = `P' = !Q\nQ' = P\n`;
const targetRules = `X' = !X\n`;

let modeler: Agent;
let reviewer: Agent;
let sourceId = "";
let targetId = "";

const network = (text: string) => compileDefinition(readRuleText(text));
function certificate() {
  const r = searchBlockEmulation(network(sourceRules), network(targetRules), { maxTime: 2, maxBlock: 2 });
  if (!r.witness) throw new Error("expected a witness");
  return blockEmulationCertificate(network(sourceRules), network(targetRules), r.witness);
}

async function mailsTo(email: string, subject: string) {
  return t.db("mail_messages").whereRaw("? = any(mail_to)", [email]).andWhere("subject", "like", `%${subject}%`);
}
async function notificationsOf(agent: Agent) {
  return (await agent.get("/api/notifications")).body.data.items as { kind: string; title: string; body: string }[];
}

beforeAll(async () => {
  modeler = await signInAs(t.app, "modeler@demo.emulant.test");
  reviewer = await signInAs(t.app, "reviewer@demo.emulant.test");
  // Defaults for this test: decisions and mentions by e-mail, waiting reviews in the app only.
  for (const a of [modeler, reviewer])
    await a
      .patch("/api/notifications/preferences")
      .send({ emailOnDecision: true, emailOnReviewWaiting: false, emailOnMention: true });
  for (const [name, ruleText] of [
    [`Notify source ${suffix}`, sourceRules],
    [`Notify target ${suffix}`, targetRules],
  ]) {
    const res = await modeler.post(`${base}/models`).send({ name, ruleText });
    expect(res.status).toBe(201);
    if (!sourceId) sourceId = res.body.data.model.id;
    else targetId = res.body.data.model.id;
  }
});
afterAll(() => t.close());

describe("notifications of the review workflow", () => {
  let reductionId = "";

  it("tells reviewers that a new reduction waits, in the app, and by e-mail once they choose it", async () => {
    const upload = await modeler
      .post(`${base}/reductions`)
      .send({ sourceModelId: sourceId, targetModelId: targetId, certificate: certificate() });
    expect(upload.status).toBe(201);
    reductionId = upload.body.data.id;
    expect((await notificationsOf(reviewer))[0]).toMatchObject({
      kind: "review.waiting",
      title: "A reduction waits for your review",
    });
    expect(await mailsTo("reviewer@demo.emulant.test", `Notify`)).toHaveLength(0);
    // The modeler caused it, so the modeler is not told.
    expect((await notificationsOf(modeler)).some((n) => n.kind === "review.waiting")).toBe(false);
  });

  it("tells the proposer when a reduction is decided, in the app and by e-mail with the reason", async () => {
    const res = await reviewer
      .post(`${base}/reductions/${reductionId}/decision`)
      .send({ decision: "reject", comment: `Not needed here ${suffix}` });
    expect(res.status).toBe(200);
    const note = (await notificationsOf(modeler))[0]!;
    expect(note).toMatchObject({ kind: "reduction.decided", title: "Your reduction was rejected" });
    expect(note.body).toContain(`Not needed here ${suffix}`);
    await expect
      .poll(async () => (await mailsTo("modeler@demo.emulant.test", "Your reduction was rejected")).length > 0)
      .toBe(true);
    const mails = await mailsTo("modeler@demo.emulant.test", "Your reduction was rejected");
    expect(mails.some((m: { text_body: string }) => m.text_body.includes(`Not needed here ${suffix}`))).toBe(true);
  });

  it("tells a member named with @ in a comment, and not the author", async () => {
    const res = await reviewer
      .post(`${base}/reductions/${reductionId}/comments`)
      .send({ body: `@mira castellan could you look again? ${suffix}` });
    expect(res.status).toBe(201);
    expect((await notificationsOf(modeler))[0]).toMatchObject({
      kind: "comment.mention",
      title: "Rowan Ashdown mentioned you",
    });
    await expect
      .poll(async () =>
        (await mailsTo("modeler@demo.emulant.test", "mentioned you")).some((m: { text_body: string }) =>
          m.text_body.includes(suffix),
        ),
      )
      .toBe(true);
    expect((await notificationsOf(reviewer)).some((n) => n.kind === "comment.mention")).toBe(false);
  });

  it("sends no e-mail of a kind the person turned off, and keeps the in-app notification", async () => {
    const saved = await modeler
      .patch("/api/notifications/preferences")
      .send({ emailOnDecision: true, emailOnReviewWaiting: false, emailOnMention: false });
    expect(saved.body.data).toEqual({ emailOnDecision: true, emailOnReviewWaiting: false, emailOnMention: false });
    const before = (await mailsTo("modeler@demo.emulant.test", "mentioned you")).length;
    await reviewer.post(`${base}/reductions/${reductionId}/comments`).send({ body: `@Mira Castellan again ${suffix}` });
    expect((await notificationsOf(modeler))[0]).toMatchObject({ kind: "comment.mention" });
    await new Promise((r) => setTimeout(r, 500));
    expect((await mailsTo("modeler@demo.emulant.test", "mentioned you")).length).toBe(before);
    const bad = await modeler.patch("/api/notifications/preferences").send({ emailOnDecision: "yes" });
    expect(bad.status).toBe(400);
  });
});

describe("POST /models/upload/preview", () => {
  it("reads a file without storing it and names the models with identical content", async () => {
    const before = (await modeler.get(`${base}/models`)).body.data.length;
    const res = await modeler
      .post(`${base}/models/upload/preview`)
      .attach("file", Buffer.from(sourceRules), { filename: "cycle.rules", contentType: "text/plain" });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.data).toMatchObject({
      fileName: "cycle.rules",
      suggestedName: "cycle",
      nodeCount: 2,
      nodes: ["P", "Q"],
      inputs: [],
      firstRules: ["P' = !Q", "Q' = P"],
    });
    expect(res.body.data.duplicates).toContainEqual(
      expect.objectContaining({ modelId: sourceId, name: `Notify source ${suffix}` }),
    );
    expect((await modeler.get(`${base}/models`)).body.data.length).toBe(before);
    const broken = await modeler
      .post(`${base}/models/upload/preview`)
      .attach("file", Buffer.from("P' = !\n"), { filename: "broken.rules", contentType: "text/plain" });
    expect(broken.status).toBe(400);
    expect(broken.body.error.code).toBe("PARSE_ERROR");
  });
});
