// The runs API against the real PostgreSQL and pg-boss, with one in-process worker where a run must finish.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { computeHierarchyRecord } from "../../server/services/automata/eca-hierarchy-compute";
import { getRun } from "../../server/db/repositories/runs";
import { loadRunSettings } from "../../server/jobs/run-settings";
import { startRunWorker, type RunWorker } from "../../server/jobs/run-worker";
import { createLogger } from "../../server/logger";
import { createFakeMailer } from "../../server/mail/mailer";
import { HierarchyRunResult } from "@shared/schemas/automata";
import type { Run } from "@shared/schemas/runs";
import { signInAs, type Agent } from "../support/sessions";
import { buildTestApp, testConfig } from "../support/test-app";

const QUEUE_CAP = 3;
process.env.RUN_QUEUE_CAP = String(QUEUE_CAP);
const t = buildTestApp();
const config = testConfig();
const log = createLogger(config);
const mailer = createFakeMailer(t.db, log);
let projectId: string;
let owner: Agent;
let viewer: Agent;
let worker: RunWorker | null = null;

const startWorker = async (over: Partial<ReturnType<typeof loadRunSettings>> = {}) => {
  worker = await startRunWorker({
    db: t.db,
    log,
    databaseUrl: config.DATABASE_URL,
    mailer,
    publicUrl: config.publicUrl,
    settings: {
      ...loadRunSettings({ RUN_HEARTBEAT_MS: "200", RUN_STALE_SECONDS: "5", RUN_REAP_EVERY_MS: "500" }, 2),
      notifyAfterSeconds: 0,
      ...over,
    },
  });
};
const stopWorker = async () => {
  await worker?.stop();
  worker = null;
};

async function finished(runId: string, timeoutMs = 30_000): Promise<Run> {
  const started = Date.now();
  for (;;) {
    const run = await getRun(t.db, runId);
    if (run && ["succeeded", "failed", "cancelled"].includes(run.state)) return run;
    if (Date.now() - started > timeoutMs) throw new Error(`run ${runId} still ${run?.state}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

const sleepCount = (itemCount: number, extra: object = {}) => ({
  kind: "sleep-count",
  params: { itemCount, shardCount: 2, delayMsPerItem: 0, ...extra },
});

beforeAll(async () => {
  owner = await signInAs(t.app, "owner@demo.emulant.test");
  viewer = await signInAs(t.app, "viewer@demo.emulant.test");
  // A fresh project per file run: no stored result from an earlier run is reused, and the queue starts empty.
  const res = await owner.post("/api/projects").send({ name: `Runs API ${randomUUID().slice(0, 8)}` });
  expect(res.status).toBe(201);
  projectId = res.body.data.id;
  const viewerId = (await t.db("users").where({ email: "viewer@demo.emulant.test" }).first()).id;
  await t.db("memberships").insert({ project_id: projectId, user_id: viewerId, role: "viewer" });
});

afterAll(async () => {
  delete process.env.RUN_QUEUE_CAP;
  await stopWorker();
  await mailer.close();
  await t.close();
});

describe("POST /api/projects/:projectId/runs without a worker", () => {
  it("queues runs up to the project's cap, then answers 429 QUEUE_FULL with a message saying what to do", async () => {
    const ids: string[] = [];
    for (let i = 0; i < QUEUE_CAP; i++) {
      const res = await owner.post(`/api/projects/${projectId}/runs`).send(sleepCount(100 + i, { delayMsPerItem: 50 }));
      expect(res.status).toBe(201);
      expect(res.body.data).toMatchObject({ state: "queued", reused: false, kind: "sleep-count", shardCount: 2 });
      ids.push(res.body.data.id);
    }
    const full = await owner.post(`/api/projects/${projectId}/runs`).send(sleepCount(999));
    expect(full.status).toBe(429);
    expect(full.body.error.code).toBe("QUEUE_FULL");
    expect(full.body.error.message).toMatch(/already has 3 runs queued or running.*cancel some/);

    // Cancelling frees a slot; cancelling twice is refused.
    const cancel = await owner.post(`/api/projects/${projectId}/runs/${ids[0]}/cancel`);
    expect(cancel.status).toBe(200);
    expect(cancel.body.data.state).toBe("cancelled");
    expect((await owner.post(`/api/projects/${projectId}/runs/${ids[0]}/cancel`)).status).toBe(409);
    for (const id of ids.slice(1))
      expect((await owner.delete(`/api/projects/${projectId}/runs/${id}`)).status).toBe(204);
    expect((await owner.get(`/api/projects/${projectId}/runs/${ids[1]}`)).status).toBe(404);
  });

  it("refuses parameters outside the kind's schema with 400 INVALID_INPUT naming the field", async () => {
    const res = await owner.post(`/api/projects/${projectId}/runs`).send(sleepCount(0));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("INVALID_INPUT");
    expect(res.body.error.message).toContain("itemCount");
  });

  it("lets a viewer read runs but not start one", async () => {
    expect((await viewer.get(`/api/projects/${projectId}/runs`)).status).toBe(200);
    expect((await viewer.post(`/api/projects/${projectId}/runs`).send(sleepCount(5))).status).toBe(403);
  });
});

describe("runs with an in-process worker", () => {
  beforeAll(() => startWorker());
  afterAll(() => stopWorker());

  it("computes a run, then answers the same request with the stored result (200, reused) instead of a new run", async () => {
    const first = await owner.post(`/api/projects/${projectId}/runs`).send(sleepCount(500));
    expect(first.status).toBe(201);
    const done = await finished(first.body.data.id);
    expect(done.state).toBe("succeeded");
    // The reference is the plain loop over every item.
    let sum = 0;
    let odd = 0;
    for (let i = 0; i < 500; i++) {
      sum += (i * 7 + 3) % 1000;
      odd += ((i * 7 + 3) % 1000) % 2;
    }
    expect(done.result).toEqual({ itemCount: 500, sum, oddCount: odd });
    // Key order in params does not matter for reuse.
    const again = await owner
      .post(`/api/projects/${projectId}/runs`)
      .send({ kind: "sleep-count", params: { delayMsPerItem: 0, shardCount: 2, itemCount: 500 } });
    expect(again.status).toBe(200);
    expect(again.body.data).toMatchObject({ id: first.body.data.id, reused: true, state: "succeeded" });
  });

  it("retries a cancelled run, keeping shards already done, and the result is complete", async () => {
    const res = await owner
      .post(`/api/projects/${projectId}/runs`)
      .send(sleepCount(900, { shardCount: 3, delayMsPerItem: 4 }));
    const id = res.body.data.id as string;
    // Cancel once a shard is done (two run at once, ~1.2 s each, then the third), so the retry has something to keep.
    for (let i = 0; i < 200; i++) {
      const r = await getRun(t.db, id);
      if (r && r.shardsDone >= 1) break;
      await new Promise((r) => setTimeout(r, 50));
    }
    expect((await owner.post(`/api/projects/${projectId}/runs/${id}/cancel`)).status).toBe(200);
    const kept = await t.db("run_shards").where({ run_id: id, state: "done" }).select("id", "completed_at");
    expect(kept.length).toBeGreaterThanOrEqual(1);
    const retry = await owner.post(`/api/projects/${projectId}/runs/${id}/retry`);
    expect(retry.status).toBe(200);
    expect(retry.body.data).toMatchObject({ state: "queued", attempt: 2 });
    const done = await finished(id);
    expect(done.state).toBe("succeeded");
    expect((done.result as { itemCount: number }).itemCount).toBe(900);
    const after = await t
      .db("run_shards")
      .whereIn(
        "id",
        kept.map((k) => k.id),
      )
      .select("id", "completed_at");
    expect(after.map((a) => a.completed_at.getTime()).sort()).toEqual(kept.map((k) => k.completed_at.getTime()).sort());
    expect((await owner.post(`/api/projects/${projectId}/runs/${id}/retry`)).status).toBe(409);
  });

  it("fails a run that exceeds its time limit with TIME_LIMIT", async () => {
    const res = await owner
      .post(`/api/projects/${projectId}/runs`)
      .send(sleepCount(400, { shardCount: 1, delayMsPerItem: 20 }));
    await t.db("runs").where({ id: res.body.data.id }).update({ time_limit_seconds: 1 });
    const done = await finished(res.body.data.id);
    expect(done.state).toBe("failed");
    expect(done.error?.code).toBe("TIME_LIMIT");
  });

  it("lists runs filtered by kind and state, newest first", async () => {
    const all = await owner.get(`/api/projects/${projectId}/runs`);
    expect(all.status).toBe(200);
    expect(all.body.data.length).toBeGreaterThanOrEqual(3);
    const created = all.body.data.map((r: Run) => Date.parse(r.createdAt));
    expect([...created].sort((a, b) => b - a)).toEqual(created);
    const failed = await owner.get(`/api/projects/${projectId}/runs?state=failed`);
    expect(failed.body.data.length).toBeGreaterThanOrEqual(1);
    expect(failed.body.data.every((r: Run) => r.state === "failed")).toBe(true);
    const none = await owner.get(`/api/projects/${projectId}/runs?kind=attractors`);
    expect(none.body.data).toEqual([]);
    expect((await owner.get(`/api/projects/${projectId}/runs?state=sleeping`)).status).toBe(400);
  });

  it("notifies the starter of a finished long run in the app and by e-mail, and marks notifications read", async () => {
    // The worker here treats every run as long (notifyAfterSeconds 0); the default threshold is one minute.
    const list = await owner.get("/api/notifications");
    expect(list.status).toBe(200);
    const mine = list.body.data.items.filter((n: { link: string }) => n.link?.includes(projectId));
    expect(mine.some((n: { kind: string }) => n.kind === "run.succeeded")).toBe(true);
    expect(
      mine.some((n: { kind: string; body: string }) => n.kind === "run.failed" && n.body.includes("time limit")),
    ).toBe(true);
    expect(list.body.data.unreadCount).toBeGreaterThanOrEqual(2);
    const mail = await t
      .db("mail_messages")
      .whereRaw("? = any(mail_to)", ["owner@demo.emulant.test"])
      .where("subject", "like", "Emulant: Your sleep-count run%");
    expect(mail.length).toBeGreaterThanOrEqual(2);
    const read = await owner.post("/api/notifications/read").send({ all: true });
    expect(read.status).toBe(200);
    expect((await owner.get("/api/notifications")).body.data.unreadCount).toBe(0);
  });

  it("runs the attractors kind on rule text: the two fixed points of a mutual-inhibition switch", async () => {
    // Two genes repressing each other have exactly the fixed points 10 and 01 under synchronous update, plus the
    // 2-cycle 00 <-> 11 (common practice; the circuit is the toggle switch of Gardner, Cantor and Collins,
    // "Construction of a genetic toggle switch in Escherichia coli", Nature 2000, read as a Boolean network).
    const res = await owner
      .post(`/api/projects/${projectId}/runs`)
      .send({ kind: "attractors", params: { ruleText: "a' = !b\nb' = !a" } });
    expect(res.status).toBe(201);
    const done = await finished(res.body.data.id);
    expect(done.state).toBe("succeeded");
    const result = done.result as { attractors: { length: number; states: string[] }[] };
    const fixed = result.attractors
      .filter((a) => a.length === 1)
      .flatMap((a) => a.states)
      .sort();
    expect(fixed).toEqual(["01", "10"]);
    expect(result.attractors.filter((a) => a.length === 2)).toHaveLength(1);
  });

  it("runs the attractors kind on a model revision of the project, and refuses a revision id from elsewhere with 404", async () => {
    const model = await owner
      .post(`/api/projects/${projectId}/models`)
      .send({ name: `Switch ${randomUUID().slice(0, 6)}`, ruleText: "a' = !b\nb' = !a" });
    expect(model.status).toBe(201);
    const revision = await t.db("model_revisions").where({ model_id: model.body.data.model.id }).first();
    const res = await owner
      .post(`/api/projects/${projectId}/runs`)
      .send({ kind: "attractors", modelRevisionId: revision.id, params: {} });
    expect(res.status).toBe(201);
    expect(res.body.data.modelRevisionId).toBe(revision.id);
    const done = await finished(res.body.data.id);
    expect(done.state).toBe("succeeded");
    expect((done.result as { attractors: unknown[] }).attractors).toHaveLength(3);
    const stranger = await owner
      .post(`/api/projects/${projectId}/runs`)
      .send({ kind: "attractors", modelRevisionId: randomUUID(), params: {} });
    expect(stranger.status).toBe(404);
    const neither = await owner.post(`/api/projects/${projectId}/runs`).send({ kind: "attractors", params: {} });
    expect(neither.status).toBe(400);
  });
});

describe("the eca-hierarchy kind", () => {
  beforeAll(() => startWorker());
  afterAll(() => stopWorker());

  it("computes the hierarchy in shards whose merge equals the one-call computation, as the automata pages expect it", async () => {
    const res = await owner
      .post(`/api/projects/${projectId}/runs`)
      .send({ kind: "eca-hierarchy", params: { maxBlock: 3 } });
    expect(res.status).toBe(201);
    expect(res.body.data.shardCount).toBe(8);
    const done = await finished(res.body.data.id, 60_000);
    expect(done.state).toBe("succeeded");
    const result = done.result as { pairs: unknown[]; emulateNothing: number[]; maxBlock: number };
    const inline = computeHierarchyRecord({ maxBlock: 3, timeMode: "block", radius: 1 }, { computedBy: null });
    expect(result.maxBlock).toBe(3);
    expect(result.pairs).toEqual(inline.pairs);
    expect(result.emulateNothing).toEqual(inline.emulateNothing);
    expect(HierarchyRunResult.safeParse(done.result).success).toBe(true);
  });
});
