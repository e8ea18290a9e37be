// Expectations and screens through the API on the real database, with an in-process run worker: the table's CRUD,
// CSV import errors with line and column (nothing stored), the automatic check of a new revision, the matrix and
// the break flag with its notification, and a screen run whose rows equal the engine's own screen.
import fs from "node:fs";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { YEAST_RULE_TEXT } from "@shared/engine/rules/yeast-rule-text.test-support";
import { runScreen } from "@shared/engine/screens";
import { ExpectationMatrix } from "@shared/schemas/expectations";
import type { Run } from "@shared/schemas/runs";
import { ScreenRunResult } from "@shared/schemas/screens";
import { loadRunSettings } from "../../server/jobs/run-settings";
import { startRunWorker, type RunWorker } from "../../server/jobs/run-worker";
import { createLogger } from "../../server/logger";
import { createFakeMailer } from "../../server/mail/mailer";
import { signInAs, type Agent } from "../support/sessions";
import { waitForRunEnd } from "../support/runs";
import { buildTestApp, testConfig } from "../support/test-app";

const t = buildTestApp();
const config = testConfig();
const log = createLogger(config);
const mailer = createFakeMailer(t.db, log);
let worker: RunWorker;
let owner: Agent;
let viewer: Agent;
let projectId = "";

// Two mutually repressing genes: under synchronous update 01 and 10 are fixed points and 00/11 a 2-cycle
// (common practice: the textbook toggle switch).
const TOGGLE = "A' = !B\nB' = !A\n";

const finished = (runId: string, timeoutMs?: number): Promise<Run> => waitForRunEnd(t.db, runId, timeoutMs);

async function createModel(name: string, ruleText: string): Promise<string> {
  const res = await owner.post(`/api/projects/${projectId}/models`).send({ name, ruleText });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.data.model.id as string;
}

const expectationsPath = (modelId: string) => `/api/projects/${projectId}/models/${modelId}/expectations`;

async function matrix(modelId: string) {
  const res = await viewer.get(`${expectationsPath(modelId)}/matrix`);
  expect(res.status).toBe(200);
  return ExpectationMatrix.parse(res.body.data);
}

async function settled(modelId: string) {
  for (const id of (await matrix(modelId)).pendingRunIds) expect((await finished(id)).state).toBe("succeeded");
  return matrix(modelId);
}

beforeAll(async () => {
  owner = await signInAs(t.app, "owner@demo.emulant.test");
  viewer = await signInAs(t.app, "viewer@demo.emulant.test");
  const res = await owner.post("/api/projects").send({ name: `Expectations API ${randomUUID().slice(0, 8)}` });
  projectId = res.body.data.id;
  const viewerId = (await t.db("users").where({ email: "viewer@demo.emulant.test" }).first()).id;
  await t.db("memberships").insert({ project_id: projectId, user_id: viewerId, role: "viewer" });
  worker = await startRunWorker({
    db: t.db,
    log,
    databaseUrl: config.DATABASE_URL,
    mailer,
    publicUrl: config.publicUrl,
    settings: {
      ...loadRunSettings({ RUN_HEARTBEAT_MS: "200", RUN_REAP_EVERY_MS: "500" }, 2),
      notifyAfterSeconds: 3600,
    },
  });
});

afterAll(async () => {
  await worker?.stop();
  await mailer.close();
  await t.close();
});

describe("expectations table", () => {
  it("POST, PATCH, GET and DELETE an expectation; a viewer may read but not write", async () => {
    const modelId = await createModel("Toggle CRUD", TOGGLE);
    const body = {
      id: "a-on",
      outcome: { kind: "some-attractor", pattern: { A: 1 } },
      source: "Tidewater notebook 1 p. 1",
    };
    expect((await viewer.post(expectationsPath(modelId)).send(body)).status).toBe(403);
    const created = await owner.post(expectationsPath(modelId)).send(body);
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body.data.expectation).toMatchObject({ id: "a-on", update: "synchronous", note: "" });
    const dup = await owner.post(expectationsPath(modelId)).send(body);
    expect(dup.status).toBe(409);
    const noSource = await owner.post(expectationsPath(modelId)).send({ ...body, id: "x", source: " " });
    expect(noSource.status).toBe(400);
    expect(JSON.stringify(noSource.body.error.details)).toContain("source");
    const rowId = created.body.data.id as string;
    const edited = await owner
      .patch(`${expectationsPath(modelId)}/${rowId}`)
      .send({ ...body, outcome: { kind: "fixed-point-count", comparison: "exactly", count: 2 } });
    expect(edited.status).toBe(200);
    expect(edited.body.data.expectation.outcome).toEqual({
      kind: "fixed-point-count",
      comparison: "exactly",
      count: 2,
    });
    const list = await viewer.get(expectationsPath(modelId));
    expect(list.body.data).toHaveLength(1);
    expect((await owner.delete(`${expectationsPath(modelId)}/${rowId}`)).status).toBe(204);
    expect((await viewer.get(expectationsPath(modelId))).body.data).toHaveLength(0);
  });

  it("POST /import refuses a table with errors, naming line and column of each, and stores nothing", async () => {
    const modelId = await createModel("Toggle import", TOGGLE);
    const csv = [
      "id,outcome,pattern,count,source",
      "ok,some-attractor,A=1,,notebook 1",
      "bad,some-attractor,A=2,,notebook 1",
      "short,some-attractor",
    ].join("\n");
    const res = await owner.post(`${expectationsPath(modelId)}/import`).send({ csv });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("PARSE_ERROR");
    const details = res.body.error.details as { line: number; column: number; message: string }[];
    expect(details.map((d) => d.line)).toEqual([3, 4]);
    expect(details[0]!.column).toBeGreaterThan(1);
    expect(details[0]!.message).toContain('"2"');
    expect((await viewer.get(expectationsPath(modelId))).body.data).toHaveLength(0);
  });

  it("GET /export writes the table in the documented CSV that imports back unchanged", async () => {
    const modelId = await createModel("Toggle export", TOGGLE);
    const csv = [
      "id,update,knock_out,outcome,pattern,count,source,note",
      'a-on,,,some-attractor,A=1,,"Notebook 2, p. 3",',
      "b-off-without-b,asynchronous,B,every-attractor,B=0,,Notebook 2 p. 4,knock-out",
    ].join("\n");
    const imported = await owner.post(`${expectationsPath(modelId)}/import`).send({ csv });
    expect(imported.status, JSON.stringify(imported.body)).toBe(200);
    expect(imported.body.data).toMatchObject({ added: 2, replaced: 0, removed: 0 });
    const exported = await viewer.get(`${expectationsPath(modelId)}/export`);
    expect(exported.status).toBe(200);
    expect(exported.headers["content-type"]).toContain("text/csv");
    const again = await owner.post(`${expectationsPath(modelId)}/import`).send({ csv: exported.text, mode: "replace" });
    expect(again.body.data).toMatchObject({ added: 0, replaced: 2, removed: 0 });
    const list = (await viewer.get(expectationsPath(modelId))).body.data as { expectation: object }[];
    expect(list.map((s) => s.expectation)).toEqual([
      expect.objectContaining({ id: "a-on", source: "Notebook 2, p. 3" }),
      expect.objectContaining({ id: "b-off-without-b", update: "asynchronous", note: "knock-out" }),
    ]);
  });
});

describe("automatic checks and the matrix", () => {
  it("the Li et al. 2004 yeast expectations pass on the yeast model, each with its exact method", async () => {
    // Li, Long, Lu, Ouyang, Tang, "The yeast cell-cycle network is robustly designed", PNAS 2004 (fixture cites rows).
    const modelId = await createModel("Yeast cell cycle", YEAST_RULE_TEXT);
    const csv = fs.readFileSync(
      path.resolve(import.meta.dirname, "../fixtures/expectations/li-2004-yeast-cell-cycle.csv"),
      "utf8",
    );
    const imported = await owner.post(`${expectationsPath(modelId)}/import`).send({ csv });
    expect(imported.status, JSON.stringify(imported.body)).toBe(200);
    expect(imported.body.data.checkRunId).toEqual(expect.any(String));
    const m = await settled(modelId);
    expect(m.cells).toHaveLength(m.expectations.length);
    for (const cell of m.cells) {
      expect(cell.status, cell.detail).toBe("pass");
      expect(cell.method).toMatch(/^exact-|synchronous-trajectory/);
    }
  });

  it("a new revision is checked on its own; one that breaks a held expectation is flagged and its author notified", async () => {
    const modelId = await createModel("Toggle revisions", TOGGLE);
    const csv = [
      "id,outcome,pattern,count,source",
      "two-fixed-points,fixed-point-count,,2,Tidewater notebook 3 p. 1",
      "a-on-somewhere,some-attractor,A=1,,Tidewater notebook 3 p. 2",
      "c-on,some-attractor,C=1,,Tidewater notebook 3 p. 3",
    ].join("\n");
    expect((await owner.post(`${expectationsPath(modelId)}/import`).send({ csv })).status).toBe(200);
    let m = await settled(modelId);
    const byKey = (key: string, revision: number) =>
      m.cells.find((c) => c.revision === revision && c.expectationId === m.expectations.find((e) => e.key === key)!.id);
    expect(byKey("two-fixed-points", 1)).toMatchObject({ status: "pass", broke: false, method: "exact-synchronous" });
    expect(byKey("c-on", 1)).toMatchObject({ status: "undecided", reason: "unknown-node" });

    // A held at 0 leaves one fixed point (01): both expectations that held now fail.
    const rev = await owner
      .post(`/api/projects/${projectId}/models/${modelId}/revisions`)
      .send({ ruleText: "A' = 0\nB' = !A\n", message: "A silenced" });
    expect(rev.status).toBe(201);
    m = await settled(modelId);
    expect(m.revisions.map((r) => r.revision)).toEqual([2, 1]);
    expect(byKey("two-fixed-points", 2)).toMatchObject({ status: "fail", broke: true });
    expect(byKey("a-on-somewhere", 2)).toMatchObject({ status: "fail", broke: true });
    expect(byKey("c-on", 2)).toMatchObject({ status: "undecided", broke: false });

    const notes = await owner.get("/api/notifications");
    const note = (notes.body.data.items as { kind: string; title: string; body: string; link: string }[]).find(
      (n) => n.kind === "expectations.broken" && n.link.includes(modelId),
    );
    expect(note?.title).toBe("Revision 2 breaks 2 expectations");
    expect(note?.body).toContain("two-fixed-points");

    // Checking again stores nothing new and flags nothing more (the stored run is reused).
    const again = await owner.post(`${expectationsPath(modelId)}/check`).send({ revision: 2 });
    expect(again.status).toBe(200);
    expect(again.body.data.reused).toBe(true);
  });

  it("the demo bloom switch opens with its matrix filled, and a check run of revision 2 agrees with the seeded results", async () => {
    const demo = "00000000-0000-4000-8000-000000000001";
    const bloom = "00000000-0000-4000-8000-000000000301";
    const path = `/api/projects/${demo}/models/${bloom}/expectations`;
    const seeded = ExpectationMatrix.parse((await owner.get(`${path}/matrix`)).body.data);
    expect(seeded.expectations).toHaveLength(9);
    expect(seeded.cells).toHaveLength(18);
    const cell = (m: ExpectationMatrix, key: string, revision: number) =>
      m.cells.find((c) => c.revision === revision && c.expectationId === m.expectations.find((e) => e.key === key)!.id);
    expect(cell(seeded, "pigment-in-light", 1)).toMatchObject({ status: "undecided", reason: "unknown-node" });
    expect(cell(seeded, "pigment-in-light", 2)).toMatchObject({ status: "pass" });
    expect(cell(seeded, "drmk-ko-stays-out-of-cyst", 2)).toMatchObject({ status: "fail", broke: false });
    expect(seeded.cells.filter((c) => c.status === "pass")).toHaveLength(15);

    const started = await owner.post(`${path}/check`).send({ revision: 2 });
    expect(started.status, JSON.stringify(started.body)).toBe(200);
    expect((await finished(started.body.data.runId as string)).state).toBe("succeeded");
    const checked = ExpectationMatrix.parse((await owner.get(`${path}/matrix`)).body.data);
    for (const e of seeded.expectations) {
      const a = cell(seeded, e.key, 2)!;
      const b = cell(checked, e.key, 2)!;
      expect(b.runId).not.toBeNull();
      expect({ status: b.status, method: b.method, detail: b.detail }).toEqual({
        status: a.status,
        method: a.method,
        detail: a.detail,
      });
    }
  });
});

describe("screen runs", () => {
  it("a sharded screen run gives the engine's rows for the toggle switch with a third node", async () => {
    const ruleText = "A' = !B\nB' = !A\nC' = A & !C\n";
    const modelId = await createModel("Toggle screen", ruleText);
    const revisionId = (await t.db("model_revisions").where({ model_id: modelId }).first()).id as string;
    const params = { nodes: ["A", "B", "C"], pairs: true, phenotype: { A: 1 as const } };
    const res = await owner
      .post(`/api/projects/${projectId}/runs`)
      .send({ kind: "screen", modelRevisionId: revisionId, params });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.data.shardCount).toBeGreaterThan(1);
    const run = await finished(res.body.data.id);
    expect(run.state, JSON.stringify(run.error)).toBe("succeeded");
    const result = ScreenRunResult.parse(run.result);
    const engine = runScreen(compileDefinition(readRuleText(ruleText)), params);
    expect(result.rows.map(({ trapSpaces: _t, ...row }) => row)).toEqual(engine.rows);
    expect(result.baseline).toEqual(engine.baseline);
  });

  it("an asynchronous screen counts minimal trap spaces with the phenotype per row", async () => {
    const modelId = await createModel("Toggle async screen", TOGGLE);
    const revisionId = (await t.db("model_revisions").where({ model_id: modelId }).first()).id as string;
    const res = await owner.post(`/api/projects/${projectId}/runs`).send({
      kind: "screen",
      modelRevisionId: revisionId,
      params: { nodes: ["B"], phenotype: { A: 1 }, update: "asynchronous" },
    });
    const run = await finished(res.body.data.id);
    const result = ScreenRunResult.parse(run.result);
    // Toggle switch: two minimal trap spaces (the fixed points 10 and 01); B knocked out leaves only 10 (A on).
    expect(result.baselineTrapSpaces).toEqual({ total: 2, withPhenotype: 1, complete: true });
    const ko = result.rows.find((r) => r.perturbation.B === 0)!;
    expect(ko.trapSpaces).toEqual({ total: 1, withPhenotype: 1, complete: true });
  });

  it("a screen naming a node the model lacks is refused with the node's name", async () => {
    const modelId = await createModel("Toggle bad screen", TOGGLE);
    const revisionId = (await t.db("model_revisions").where({ model_id: modelId }).first()).id as string;
    const res = await owner.post(`/api/projects/${projectId}/runs`).send({
      kind: "screen",
      modelRevisionId: revisionId,
      params: { nodes: ["Z"], phenotype: { A: 1 } },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toContain("Z");
  });
});
