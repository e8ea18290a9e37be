// Reductions through the API against the real database: a certificate enters review only when it verifies and
// matches the stored models; reviewers decide and re-verify, everyone in the project can discuss; approved
// reductions form the model hierarchy, where F0 -> F and F -> G compose into a verified F0 -> G.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getRun } from "../../server/db/repositories/runs";
import { loadRunSettings } from "../../server/jobs/run-settings";
import { startRunWorker, type RunWorker } from "../../server/jobs/run-worker";
import { createLogger } from "../../server/logger";
import { createFakeMailer } from "../../server/mail/mailer";
import { blockEmulationCertificate, verifyCertificate } from "@shared/engine/certificates";
import { searchBlockEmulation } from "@shared/engine/emulation";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { signInAs, type Agent } from "../support/sessions";
import { buildTestApp, testConfig } from "../support/test-app";

const t = buildTestApp();
const config = testConfig();
const log = createLogger(config);
const mailer = createFakeMailer(t.db, log);
let worker: RunWorker | null = null;
/** The demo seed's tide clock: a three-gene repressor ring hidden in two-node blocks (seeds/03-demo-models.ts). */
const TIDE_CLOCK_MODEL = "00000000-0000-4000-8000-000000000302";
const DEMO_PROJECT = "00000000-0000-4000-8000-000000000001";
const base = `/api/projects/${DEMO_PROJECT}`;
const suffix = Date.now().toString(36);

// The worked example of the README: F (a 4-cycle) emulates G (X' = !X) at t = 2 with block {P, Q} and codewords 00/11;
// F0 (two synchronised copies of F) emulates F at t = 1.
const rules = {
  F0: "P1' = !Q1\nP2' = !Q2\nQ1' = P1\nQ2' = P2\n",
  F: "P' = !Q\nQ' = P\n",
  G: "X' = !X\n",
};

const network = (text: string) => compileDefinition(readRuleText(text));
function certificate(sourceRules: string, targetRules: string, maxTime: number) {
  const source = network(sourceRules);
  const target = network(targetRules);
  const r = searchBlockEmulation(source, target, { maxTime, maxBlock: 4 });
  if (!r.witness) throw new Error("expected a witness");
  return blockEmulationCertificate(source, target, r.witness);
}

let modeler: Agent;
let reviewer: Agent;
let viewer: Agent;
const modelIds: Record<keyof typeof rules, string> = { F0: "", F: "", G: "" };
/** A fresh copy of the demo tide clock, so no stored search result of an earlier run on this database is reused. */
let tideClock = "";

beforeAll(async () => {
  modeler = await signInAs(t.app, "modeler@demo.emulant.test");
  reviewer = await signInAs(t.app, "reviewer@demo.emulant.test");
  viewer = await signInAs(t.app, "viewer@demo.emulant.test");
  for (const [key, ruleText] of Object.entries(rules) as [keyof typeof rules, string][]) {
    const res = await modeler.post(`${base}/models`).send({ name: `Reduction test ${key} ${suffix}`, ruleText });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    modelIds[key] = res.body.data.model.id;
  }
  const demo = await modeler.get(`${base}/models/${TIDE_CLOCK_MODEL}`);
  const copy = await modeler
    .post(`${base}/models`)
    .send({ name: `Tide clock copy ${suffix}`, ruleText: demo.body.data.revision.ruleText });
  expect(copy.status).toBe(201);
  tideClock = copy.body.data.model.id;
});
afterAll(async () => {
  await worker?.stop();
  await mailer.close();
  await t.close();
});

async function finishedRun(runId: string, timeoutMs = 60_000) {
  const started = Date.now();
  for (;;) {
    const run = await getRun(t.db, runId);
    if (run && ["succeeded", "failed", "cancelled"].includes(run.state)) return run;
    if (Date.now() - started > timeoutMs) throw new Error(`run ${runId} still ${run?.state}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

async function upload(agent: Agent, source: keyof typeof rules, target: keyof typeof rules | undefined, cert: unknown) {
  return agent
    .post(`${base}/reductions`)
    .send({ sourceModelId: modelIds[source], targetModelId: target && modelIds[target], certificate: cert });
}

describe("POST /reductions (certificate upload)", () => {
  it("refuses a tampered certificate with INVALID_CERTIFICATE and stores nothing", async () => {
    const cert = certificate(rules.F, rules.G, 2);
    if (cert.notion !== "block-emulation") throw new Error("expected a block emulation certificate");
    const tampered = { ...cert, witness: { ...cert.witness, blocks: [{ ...cert.witness.blocks[0]!, one: "10" }] } };
    const before = (await modeler.get(`${base}/reductions?sourceModelId=${modelIds.F}`)).body.data.length;
    const res = await upload(modeler, "F", "G", tampered);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("INVALID_CERTIFICATE");
    expect((await modeler.get(`${base}/reductions?sourceModelId=${modelIds.F}`)).body.data.length).toBe(before);
  });

  it("refuses a certificate whose source is not the chosen model", async () => {
    const res = await upload(modeler, "G", undefined, certificate(rules.F, rules.G, 2));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("SOURCE_MISMATCH");
  });

  it("rejects a malformed certificate at the edge, naming the field", async () => {
    const res = await upload(modeler, "F", undefined, {
      format: "emulant-reduction",
      version: 1,
      notion: "block-emulation",
      time: 0,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("INVALID_INPUT");
    expect(res.body.error.message).toMatch(/^body\.certificate/);
  });

  it("does not let a viewer or a reviewer submit certificates", async () => {
    expect((await upload(viewer, "F", "G", certificate(rules.F, rules.G, 2))).status).toBe(403);
    expect((await upload(reviewer, "F", "G", certificate(rules.F, rules.G, 2))).status).toBe(403);
  });
});

describe("review and the model hierarchy", () => {
  let fToG = "";
  let f0ToF = "";

  it("stores a valid certificate once, as proposed and verified", async () => {
    const first = await upload(modeler, "F", "G", certificate(rules.F, rules.G, 2));
    expect(first.status).toBe(201);
    expect(first.body.data).toMatchObject({
      reviewState: "proposed",
      notion: "block-emulation",
      timeScale: 2,
      lastVerification: { isValid: true },
    });
    fToG = first.body.data.id;
    const again = await upload(modeler, "F", "G", certificate(rules.F, rules.G, 2));
    expect(again.status).toBe(200);
    expect(again.body.data.id).toBe(fToG);
    const second = await upload(modeler, "F0", "F", certificate(rules.F0, rules.F, 1));
    expect(second.status).toBe(201);
    f0ToF = second.body.data.id;
  });

  it("lets only reviewers (and owners) decide", async () => {
    expect((await modeler.post(`${base}/reductions/${fToG}/decision`).send({ decision: "approve" })).status).toBe(403);
    expect((await viewer.post(`${base}/reductions/${fToG}/decision`).send({ decision: "approve" })).status).toBe(403);
    expect((await reviewer.post(`${base}/reductions/${fToG}/decision`).send({ decision: "maybe" })).status).toBe(400);
  });

  it("records re-verification and threaded comments", async () => {
    const v = await reviewer.post(`${base}/reductions/${fToG}/verify`);
    expect(v.status).toBe(200);
    expect(v.body.data.events.at(-1)).toMatchObject({ kind: "verify", outcome: { isValid: true } });
    const c1 = await modeler
      .post(`${base}/reductions/${fToG}/comments`)
      .send({ body: "Blocks {P, Q} carry X; is t = 2 expected?" });
    expect(c1.status).toBe(201);
    const parentId = c1.body.data.comments.at(-1).id;
    const c2 = await reviewer
      .post(`${base}/reductions/${fToG}/comments`)
      .send({ body: "Yes: F is a 4-cycle, G a 2-cycle.", parentId });
    expect(c2.body.data.comments.at(-1).parentId).toBe(parentId);
    expect((await reviewer.post(`${base}/reductions/${fToG}/comments`).send({ body: "   " })).status).toBe(400);
    const badParent = await reviewer
      .post(`${base}/reductions/${fToG}/comments`)
      .send({ body: "x", parentId: "00000000-0000-4000-8000-00000000abcd" });
    expect(badParent.status).toBe(400);
    expect((await viewer.post(`${base}/reductions/${fToG}/comments`).send({ body: "viewers only read" })).status).toBe(
      403,
    );
  });

  it("shows approved reductions and their verified composition in the model hierarchy", async () => {
    const hierarchyEdges = async () =>
      (await viewer.get(`${base}/model-hierarchy`)).body.data.edges as {
        source: string;
        target: string;
        isComposed: boolean;
        timeScale: number;
      }[];
    const mine = (edges: Awaited<ReturnType<typeof hierarchyEdges>>) =>
      edges.filter((e) => Object.values(modelIds).includes(e.source));
    expect(mine(await hierarchyEdges())).toEqual([]);
    for (const id of [fToG, f0ToF]) {
      const res = await reviewer
        .post(`${base}/reductions/${id}/decision`)
        .send({ decision: "approve", comment: "checked the runs" });
      expect(res.status).toBe(200);
      expect(res.body.data.reviewState).toBe("approved");
    }
    const edges = mine(await hierarchyEdges());
    expect(edges).toContainEqual(
      expect.objectContaining({ source: modelIds.F, target: modelIds.G, isComposed: false, timeScale: 2 }),
    );
    expect(edges).toContainEqual(
      expect.objectContaining({ source: modelIds.F0, target: modelIds.F, isComposed: false, timeScale: 1 }),
    );
    expect(edges).toContainEqual(
      expect.objectContaining({ source: modelIds.F0, target: modelIds.G, isComposed: true, timeScale: 2 }),
    );
  });

  it("writes every review step to the audit log", async () => {
    const audit = await modeler.get(`${base}/audit?limit=200`);
    const actions = (audit.body.data.items ?? audit.body.data).map((e: { action: string }) => e.action);
    for (const a of ["reduction.upload", "reduction.verify", "reduction.comment", "reduction.approve"])
      expect(actions).toContain(a);
  });

  it("serves the certificate as a download", async () => {
    const res = await viewer.get(`${base}/reductions/${fToG}/certificate`);
    expect(res.status).toBe(200);
    expect(res.headers["content-disposition"]).toContain("attachment");
    expect(JSON.parse(res.text)).toMatchObject({ format: "emulant-reduction", notion: "block-emulation", time: 2 });
  });
});

let discoverRunId = "";

describe("POST /reductions/searches (searches as background runs)", () => {
  beforeAll(async () => {
    worker = await startRunWorker({
      db: t.db,
      log,
      databaseUrl: config.DATABASE_URL,
      mailer,
      publicUrl: config.publicUrl,
      settings: {
        ...loadRunSettings({ RUN_HEARTBEAT_MS: "200", RUN_STALE_SECONDS: "5", RUN_REAP_EVERY_MS: "500" }, 2),
        notifyAfterSeconds: 3600,
      },
    });
  });

  it("discovers the repressor ring hidden in the demo tide clock and stores it as a proposed, valid reduction", async () => {
    const res = await modeler
      .post(`${base}/reductions/searches`)
      .send({ mode: "discover", sourceModelId: tideClock, maxTargetNodes: 3, maxTime: 1, maxBlock: 2 });
    expect([200, 201]).toContain(res.status);
    const run = await finishedRun(res.body.data.id);
    expect(run.state, JSON.stringify(run.error)).toBe("succeeded");
    discoverRunId = run.id;
    const result = run.result as {
      reductionIds: string[];
      distinctTargets: number;
      heldBack: { notListed: number; flagged: number; beyondLimit: number };
      findings: {
        flags: string[];
        reductionId: string | null;
        certificate: { target: { nodes: { name: string; inputs: string[]; table: string }[] } };
      }[];
    };
    // Only unflagged findings enter review; the full ranked list stays on the run, and the counts add up.
    const unflagged = result.findings.filter((f) => f.flags.length === 0);
    expect(result.reductionIds).toEqual(unflagged.slice(0, 10).map((f) => f.reductionId));
    expect(result.findings.filter((f) => f.flags.length > 0).every((f) => f.reductionId === null)).toBe(true);
    expect(result.heldBack.flagged).toBe(result.findings.length - unflagged.length);
    expect(result.reductionIds.length + result.heldBack.flagged + result.heldBack.beyondLimit).toBe(
      result.findings.length,
    );
    expect(result.findings.length + result.heldBack.notListed).toBe(result.distinctTargets);
    // The best-ranked target is the ring X1 -| X2 -| X3 -| X1: three nodes, each the negation of one other node.
    const ring = result.findings[0]!.certificate.target.nodes;
    expect(ring).toHaveLength(3);
    for (const node of ring) expect(node).toMatchObject({ inputs: [expect.any(String)], table: "10" });
    expect(new Set(ring.map((n) => n.inputs[0])).size).toBe(3);
    const stored = await modeler.get(`${base}/reductions/${result.reductionIds[0]}`);
    expect(stored.body.data).toMatchObject({
      reviewState: "proposed",
      foundInRunId: run.id,
      target: null,
      lastVerification: { isValid: true, checkedBy: null },
    });
    expect(verifyCertificate(stored.body.data.certificate).valid).toBe(true);

    // Saving the discovered ring as a model links the reduction to it; approving it puts the edge in the hierarchy.
    const saved = await modeler
      .post(`${base}/reductions/${result.reductionIds[0]}/save-target`)
      .send({ name: `Tide ring ${suffix}` });
    expect(saved.status).toBe(201);
    expect(saved.body.data.target).toMatchObject({ modelName: `Tide ring ${suffix}`, revision: 1 });
    expect(
      (await modeler.post(`${base}/reductions/${result.reductionIds[0]}/save-target`).send({ name: "again" })).status,
    ).toBe(409);
    const ringModel = await modeler.get(`${base}/models/${saved.body.data.target.modelId}`);
    expect(ringModel.body.data.revision.network.nodes).toHaveLength(3);
    await reviewer.post(`${base}/reductions/${result.reductionIds[0]}/decision`).send({ decision: "approve" });
    const edges = (await viewer.get(`${base}/model-hierarchy`)).body.data.edges;
    expect(edges).toContainEqual(
      expect.objectContaining({ source: tideClock, target: saved.body.data.target.modelId, isComposed: false }),
    );
  });

  it("answers a repeated search with the stored run instead of searching again", async () => {
    const body = {
      mode: "given-target",
      notion: "block-emulation",
      sourceModelId: modelIds.F,
      targetModelId: modelIds.G,
      maxTime: 2,
      maxBlock: 2,
    };
    const first = await modeler.post(`${base}/reductions/searches`).send(body);
    expect(first.status).toBe(201);
    const run = await finishedRun(first.body.data.id);
    expect(run.state).toBe("succeeded");
    expect((run.result as { found: boolean }).found).toBe(true);
    const again = await modeler.post(`${base}/reductions/searches`).send(body);
    expect(again.status).toBe(200);
    expect(again.body.data).toMatchObject({ id: run.id, reused: true });
  });

  it("reports a search that finds nothing as a succeeded run with no findings, within its bounds", async () => {
    const res = await modeler.post(`${base}/reductions/searches`).send({
      mode: "given-target",
      notion: "block-emulation",
      sourceModelId: modelIds.G,
      targetModelId: modelIds.F,
      maxTime: 1,
      maxBlock: 1,
    });
    const run = await finishedRun(res.body.data.id);
    expect(run.state).toBe("succeeded");
    expect(run.result).toMatchObject({ found: false, findings: [], bounds: { maxTime: 1, maxBlock: 1 } });
  });

  it("refuses observables that are not nodes of the source, naming them", async () => {
    const res = await modeler
      .post(`${base}/reductions/searches`)
      .send({ mode: "coarse-grain", sourceModelId: modelIds.F, observe: ["P", "Nope"] });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toContain('"Nope"');
  });

  it("refuses searches from viewers and reviewers, and for models of other projects", async () => {
    const body = { mode: "discover", sourceModelId: modelIds.F, maxTargetNodes: 1 };
    expect((await viewer.post(`${base}/reductions/searches`).send(body)).status).toBe(403);
    expect((await reviewer.post(`${base}/reductions/searches`).send(body)).status).toBe(403);
    const other = await modeler
      .post(`${base}/reductions/searches`)
      .send({ ...body, sourceModelId: "00000000-0000-4000-8000-00000000ffff" });
    expect(other.status).toBe(404);
  });
});

describe("the review queue: proposals from a run, F = G refused, filters and bulk decisions", () => {
  it("proposes a flagged finding kept on the run with one call, once, and records it on the run", async () => {
    const run = await getRun(t.db, discoverRunId);
    const findings = (run!.result as { findings: { rank: number; flags: string[]; reductionId: string | null }[] })
      .findings;
    const flagged = findings.find((f) => f.flags.length > 0 && f.reductionId === null);
    expect(flagged, "the tide clock search keeps flagged findings").toBeDefined();
    const body = { runId: discoverRunId, rank: flagged!.rank };
    expect((await viewer.post(`${base}/reductions/proposals`).send(body)).status).toBe(403);
    const first = await modeler.post(`${base}/reductions/proposals`).send(body);
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(first.body.data).toMatchObject({ reviewState: "proposed", flags: flagged!.flags, rank: flagged!.rank });
    const again = await modeler.post(`${base}/reductions/proposals`).send(body);
    expect(again.status).toBe(200);
    expect(again.body.data.id).toBe(first.body.data.id);
    const after = (await getRun(t.db, discoverRunId))!.result as { findings: { rank: number; reductionId: string }[] };
    expect(after.findings.find((f) => f.rank === flagged!.rank)!.reductionId).toBe(first.body.data.id);
    const missing = await modeler.post(`${base}/reductions/proposals`).send({ runId: discoverRunId, rank: 100000 });
    expect(missing.status).toBe(404);
  });

  it("refuses a reduction of a model onto itself (F = G) in searches and uploads", async () => {
    const search = await modeler.post(`${base}/reductions/searches`).send({
      mode: "given-target",
      notion: "block-emulation",
      sourceModelId: modelIds.F,
      targetModelId: modelIds.F,
    });
    expect(search.status).toBe(400);
    expect(search.body.error.code).toBe("SELF_REDUCTION");
    const self = await upload(modeler, "F", undefined, certificate(rules.F, rules.F, 1));
    expect(self.status).toBe(400);
    expect(self.body.error.code).toBe("SELF_REDUCTION");
  });

  it("filters the queue by flag, size and run, and sorts by size", async () => {
    const none = (await reviewer.get(`${base}/reductions?flag=none`)).body.data as { flags: string[] }[];
    expect(none.length).toBeGreaterThan(0);
    expect(none.every((r) => r.flags.length === 0)).toBe(true);
    const ofRun = (await reviewer.get(`${base}/reductions?runId=${discoverRunId}&sort=smallest`)).body.data as {
      targetNodeCount: number;
      foundInRunId: string;
    }[];
    expect(ofRun.every((r) => r.foundInRunId === discoverRunId)).toBe(true);
    const sizes = ofRun.map((r) => r.targetNodeCount);
    expect(sizes).toEqual([...sizes].sort((a, b) => a - b));
    const small = (await reviewer.get(`${base}/reductions?maxTargetNodes=1`)).body.data as {
      targetNodeCount: number;
    }[];
    expect(small.every((r) => r.targetNodeCount <= 1)).toBe(true);
    const bad = await reviewer.get(`${base}/reductions?flag=shiny`);
    expect(bad.status).toBe(400);
  });

  it("decides many reductions at once, and needs a reason to reject", async () => {
    const proposed = (await reviewer.get(`${base}/reductions?state=proposed&runId=${discoverRunId}`)).body.data as {
      id: string;
    }[];
    expect(proposed.length).toBeGreaterThanOrEqual(2);
    const ids = proposed.slice(0, 2).map((r) => r.id);
    const noReason = await reviewer
      .post(`${base}/reductions/decisions`)
      .send({ decision: "reject", reductionIds: ids });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.details).toContainEqual(expect.objectContaining({ field: "body.comment" }));
    const single = await reviewer.post(`${base}/reductions/${ids[0]}/decision`).send({ decision: "reject" });
    expect(single.status).toBe(400);
    expect(
      (await modeler.post(`${base}/reductions/decisions`).send({ decision: "approve", reductionIds: ids })).status,
    ).toBe(403);
    const res = await reviewer
      .post(`${base}/reductions/decisions`)
      .send({ decision: "reject", comment: "Uninformative for this project", reductionIds: ids });
    expect(res.status).toBe(200);
    expect(res.body.data).toEqual({ decided: ids, skipped: [] });
    for (const id of ids) {
      const r = (await viewer.get(`${base}/reductions/${id}`)).body.data;
      expect(r.reviewState).toBe("rejected");
      expect(r.events.at(-1)).toMatchObject({ kind: "reject", comment: "Uninformative for this project" });
    }
  });
});
