// Node elimination and percolation of constants end to end: runs through the API, pg-boss and a worker on the
// 40-node cell cycle with a delay line (tests/support/large-model-fixtures.ts: Faure, Naldi, Chaouiya, Thieffry,
// "Dynamical analysis of a generic Boolean model for the control of the mammalian cell cycle", Bioinformatics 2006,
// rules written from memory), saving the reduced model, its reduction and its place in the model hierarchy.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { loadRunSettings } from "../../server/jobs/run-settings";
import { startRunWorker, type RunWorker } from "../../server/jobs/run-worker";
import { createLogger } from "../../server/logger";
import { createFakeMailer } from "../../server/mail/mailer";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import type { BooleanNetwork } from "@shared/engine/network";
import { NodeEliminationResult } from "@shared/schemas/run-tasks";
import type { Run } from "@shared/schemas/runs";
import { DELAY_LINE_LENGTH, FAURE_STABLE_STATE, FAURE_WITH_DELAY_LINE } from "../support/large-model-fixtures";
import { signInAs, type Agent } from "../support/sessions";
import { waitForRunEnd } from "../support/runs";
import { buildTestApp, testConfig } from "../support/test-app";

const t = buildTestApp();
const config = testConfig();
const log = createLogger(config);
const mailer = createFakeMailer(t.db, log);
let projectId: string;
let sourceModelId: string;
let revisionId: string;
let owner: Agent;
let viewer: Agent;
let worker: RunWorker | null = null;

const CORE = ["CycD", "Rb", "E2F", "CycE", "CycA", "p27", "Cdc20", "Cdh1", "UbcH10", "CycB"];
const DELAY = Array.from({ length: DELAY_LINE_LENGTH }, (_, k) => `Out${k + 1}`);

async function start(params: object, revision = revisionId): Promise<Run> {
  const res = await owner
    .post(`/api/projects/${projectId}/runs`)
    .send({ kind: "node-elimination", modelRevisionId: revision, params });
  expect(res.status).toBe(201);
  return waitForRunEnd(t.db, res.body.data.id);
}

async function succeeded(params: object, revision = revisionId): Promise<NodeEliminationResult> {
  const done = await start(params, revision);
  expect(done.error).toBeNull();
  expect(done.state).toBe("succeeded");
  return NodeEliminationResult.parse(done.result);
}

/** Every fixed point of a small network, by trying all states (node order, 0/1 text). */
function fixedPoints(net: BooleanNetwork): string[] {
  const n = net.names.length;
  const out: string[] = [];
  for (let x = 0; x < 2 ** n; x++) {
    const bit = (v: number) => Math.floor(x / 2 ** v) % 2;
    const fixed = net.names.every((_, i) => {
      let row = 0;
      net.regulators[i]!.forEach((r, j) => (row += bit(r) * 2 ** j));
      return net.tables[i]![row] === bit(i);
    });
    if (fixed) out.push(net.names.map((_, i) => bit(i)).join(""));
  }
  return out;
}

beforeAll(async () => {
  owner = await signInAs(t.app, "owner@demo.emulant.test");
  viewer = await signInAs(t.app, "viewer@demo.emulant.test");
  const project = await owner.post("/api/projects").send({ name: `Elimination ${randomUUID().slice(0, 8)}` });
  expect(project.status).toBe(201);
  projectId = project.body.data.id;
  const viewerId = (await t.db("users").where({ email: "viewer@demo.emulant.test" }).first("id")) as { id: string };
  await t.db("memberships").insert({ project_id: projectId, user_id: viewerId.id, role: "viewer" });
  const model = await owner
    .post(`/api/projects/${projectId}/models`)
    .send({ name: "Cell cycle with delay line", ruleText: FAURE_WITH_DELAY_LINE });
  expect(model.status).toBe(201);
  sourceModelId = model.body.data.model.id;
  revisionId = model.body.data.revision.id;
  worker = await startRunWorker({
    db: t.db,
    log,
    databaseUrl: config.DATABASE_URL,
    mailer,
    publicUrl: config.publicUrl,
    settings: { ...loadRunSettings({ RUN_HEARTBEAT_MS: "200" }, 2), notifyAfterSeconds: 0 },
  });
});

afterAll(async () => {
  await worker?.stop();
  await mailer.close();
  await t.close();
});

describe("node elimination as a run", () => {
  let runId: string;
  let reducedModelId: string;
  let reductionId: string;

  it("eliminating the delay line gives back the 10-node cell cycle with its published stable state as only fixed point", async () => {
    const done = await start({ mode: "nodes", nodes: [...DELAY].reverse() });
    expect(done.state).toBe("succeeded");
    runId = done.id;
    const result = NodeEliminationResult.parse(done.result);
    expect(result).toMatchObject({ mode: "nodes", nodesBefore: 40, nodesAfter: 10, kept: CORE, fixed: [] });
    expect(result.eliminated).toEqual([...DELAY].reverse());
    expect(result.preserves).toMatch(/Fixed points, one to one/);
    expect(result.notEliminated.find((s) => s.node === "CycD")?.reason).toBe("regulates itself");
    const reduced = compileDefinition(readRuleText(result.ruleText));
    expect(fixedPoints(reduced)).toEqual([FAURE_STABLE_STATE.slice(0, 10)]);
    expect(result.certificate?.notion).toBe("node-elimination");
  });

  it("a viewer may neither start an elimination nor save its result", async () => {
    const started = await viewer
      .post(`/api/projects/${projectId}/runs`)
      .send({ kind: "node-elimination", modelRevisionId: revisionId, params: { mode: "all-eligible" } });
    expect(started.status).toBe(403);
    const saved = await viewer
      .post(`/api/projects/${projectId}/reductions/reduced-models`)
      .send({ runId, name: "Not allowed" });
    expect(saved.status).toBe(403);
  });

  it("saving makes a new model and a proposed, verified reduction from its source revision", async () => {
    const res = await owner
      .post(`/api/projects/${projectId}/reductions/reduced-models`)
      .send({ runId, name: "Cell cycle, delay line eliminated" });
    expect(res.status).toBe(201);
    reducedModelId = res.body.data.modelId;
    const reduction = res.body.data.reduction;
    reductionId = reduction.id;
    expect(reduction).toMatchObject({
      notion: "node-elimination",
      reviewState: "proposed",
      source: { modelId: sourceModelId, revision: 1 },
      target: { modelId: reducedModelId, revision: 1 },
      targetNodeCount: 10,
    });
    expect(reduction.lastVerification.isValid).toBe(true);
    const model = await owner.get(`/api/projects/${projectId}/models/${reducedModelId}`);
    expect(model.status).toBe(200);
    expect(model.body.data.model.description).toMatch(/fixed points one to one/);
    expect(model.body.data.model.description).toMatch(/statement about the model, not about the cell/);
    expect(model.body.data.model.nodeCount).toBe(10);
    const again = await owner
      .post(`/api/projects/${projectId}/reductions/reduced-models`)
      .send({ runId, name: "Twice" });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("ALREADY_SAVED");
  });

  it("the stored certificate re-verifies, and once approved the hierarchy links source and reduced model", async () => {
    const verified = await owner.post(`/api/projects/${projectId}/reductions/${reductionId}/verify`);
    expect(verified.status).toBe(200);
    expect(verified.body.data.lastVerification.isValid).toBe(true);
    expect(verified.body.data.lastVerification.message).toMatch(/truth-table rows/);
    const approved = await owner
      .post(`/api/projects/${projectId}/reductions/${reductionId}/decision`)
      .send({ decision: "approve" });
    expect(approved.status).toBe(200);
    const hierarchy = await owner.get(`/api/projects/${projectId}/model-hierarchy`);
    expect(hierarchy.body.data.edges).toContainEqual(
      expect.objectContaining({ source: sourceModelId, target: reducedModelId, notion: "node-elimination" }),
    );
  });

  it("percolation with CycD held off on the reduced model keeps the published stable state", async () => {
    const revision = await owner.get(`/api/projects/${projectId}/models/${reducedModelId}`);
    const reducedRevisionId = revision.body.data.revision.id;
    const result = await succeeded({ mode: "percolate", hold: [{ node: "CycD", value: 0 }] }, reducedRevisionId);
    expect(result.fixed).toContainEqual({ node: "CycD", value: 0 });
    expect(result.preserves).toMatch(/CycD held fixed: all attractors/);
    // The published stable state (CycD off) is the reduced model's only fixed point, on the nodes left free.
    const reduced = compileDefinition(readRuleText(result.ruleText));
    const stable = Object.fromEntries(CORE.map((name, i) => [name, FAURE_STABLE_STATE[i]]));
    expect(fixedPoints(reduced)).toEqual([reduced.names.map((name) => stable[name]).join("")]);
    expect(result.certificate?.notion).toBe("constant-percolation");
  });

  it("an unknown node or a self-regulated node ends the run with the engine's message", async () => {
    const unknown = await start({ mode: "nodes", nodes: ["Nope"] });
    expect(unknown.state).toBe("failed");
    expect(unknown.error).toEqual({ code: "UNKNOWN_NODE", message: 'there is no node named "Nope"' });
    const self = await start({ mode: "nodes", nodes: ["CycD"] });
    expect(self.state).toBe("failed");
    expect(self.error?.code).toBe("SELF_REGULATED");
    expect(self.error?.message).toMatch(/"CycD" regulates itself/);
  });

  it("refuses bad parameters before queueing, saying where", async () => {
    const res = await owner
      .post(`/api/projects/${projectId}/runs`)
      .send({ kind: "node-elimination", modelRevisionId: revisionId, params: { mode: "nodes", nodes: [] } });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.error)).toMatch(/choose at least one node/);
  });
});
