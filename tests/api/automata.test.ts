// The automata API against the real test database: hierarchies are computed once, stored and reused; every stored
// witness passes the engine's independent verifier; bad parameters get a clear 400.
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ecaRule } from "@shared/engine/automata";
import { verifyEmulation } from "@shared/engine/block-emulation";
import { computeHierarchyRecord } from "../../server/services/automata/eca-hierarchy-compute";
import {
  deleteHierarchy,
  findHierarchy,
  hierarchyPairs,
  hierarchyPairsWithWitnesses,
} from "../../server/db/repositories/eca-hierarchies";
import { getRun } from "../../server/db/repositories/runs";
import { loadRunSettings } from "../../server/jobs/run-settings";
import { startRunWorker } from "../../server/jobs/run-worker";
import { createLogger } from "../../server/logger";
import { signInAs, type Agent } from "../support/sessions";
import { buildTestApp, testConfig } from "../support/test-app";

const t = buildTestApp();
const DEMO_PROJECT = "00000000-0000-4000-8000-000000000001";
let viewer: Agent;
let viewerId: string;

beforeAll(async () => {
  viewer = await signInAs(t.app, "viewer@demo.emulant.test");
  viewerId = (await viewer.get("/api/users/me")).body.data.id as string;
  for (const maxBlock of [4, 5, 11, 17]) await deleteHierarchy(t.db, { maxBlock, timeMode: "block", radius: 1 });
});
afterAll(() => t.close());

describe("GET /api/automata/hierarchy", () => {
  it("GET /api/automata/hierarchy refuses anonymous callers with 401", async () => {
    const res = await request(t.app).get("/api/automata/hierarchy?maxBlock=3");
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe("UNAUTHENTICATED");
  });

  it("GET /api/automata/hierarchy computes K = 11 on first request, stores it with its provenance, and reuses it after", async () => {
    const first = await viewer.get("/api/automata/hierarchy?maxBlock=11");
    expect(first.status).toBe(200);
    expect(first.body.data.computedNow).toBe(true);
    expect(first.body.data.computedBy.id).toBe(viewerId);
    expect(first.body.data.durationMs).toBeGreaterThan(0);
    const stored = await findHierarchy(t.db, { maxBlock: 11, timeMode: "block", radius: 1 });
    expect(stored?.id).toBe(first.body.data.id);
    expect(stored?.pairCount).toBe(first.body.data.pairs.length);

    const second = await viewer.get("/api/automata/hierarchy?maxBlock=11");
    expect(second.status).toBe(200);
    expect(second.body.data.computedNow).toBe(false);
    expect(second.body.data.id).toBe(first.body.data.id);
    expect(second.body.data.pairs).toEqual(first.body.data.pairs);
  });

  it("GET /api/automata/hierarchy lists every rule as emulating itself with block size 1 and 88 symmetry classes", async () => {
    const res = await viewer.get("/api/automata/hierarchy?maxBlock=11");
    const selfPairs = (res.body.data.pairs as { source: number; target: number; minBlock: number }[]).filter(
      (p) => p.source === p.target,
    );
    expect(selfPairs).toHaveLength(256);
    expect(selfPairs.every((p) => p.minBlock === 1)).toBe(true);
    // 88 classes under reflection and complement: Li & Packard, "The structure of the elementary cellular automata
    // rule space", Complex Systems 4 (1990)
    expect(res.body.data.symmetryClasses).toHaveLength(88);
  });

  it("GET /api/automata/hierarchy shares one computation between two simultaneous first requests", async () => {
    const [a, b] = await Promise.all([
      viewer.get("/api/automata/hierarchy?maxBlock=4"),
      viewer.get("/api/automata/hierarchy?maxBlock=4"),
    ]);
    expect(a.status).toBe(200);
    expect(b.status).toBe(200);
    expect(a.body.data.id).toBe(b.body.data.id);
    const count = await t
      .db("eca_hierarchies")
      .where({ max_block: 4, time_mode: "block", radius: 1 })
      .count<{ count: string }[]>("* as count");
    expect(Number(count[0]!.count)).toBe(1);
  });

  it("GET /api/automata/hierarchy answers 404 HIERARCHY_NOT_COMPUTED above block size 11 when no run has stored it", async () => {
    const res = await viewer.get("/api/automata/hierarchy?maxBlock=17");
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe("HIERARCHY_NOT_COMPUTED");
    expect(res.body.error.message).toContain("background");
    expect(res.body.error.details).toMatchObject({ maxBlock: 17, inlineMaxBlock: 11 });
  });

  it("GET /api/automata/hierarchy rejects malformed parameters with 400 naming the field", async () => {
    const cases: [string, string][] = [
      ["maxBlock=abc", "query.maxBlock: maxBlock must be a whole number"],
      ["maxBlock=0", "query.maxBlock: maxBlock must be at least 1"],
      ["maxBlock=99", "query.maxBlock: maxBlock must be at most 18"],
      ["maxBlock=5&timeMode=sometimes", "query.timeMode"],
      ["maxBlock=5&radius=2", "query.radius"],
      ["maxBlock=5&colour=red", "colour"],
    ];
    for (const [query, message] of cases) {
      const res = await viewer.get(`/api/automata/hierarchy?${query}`);
      expect(res.status, query).toBe(400);
      expect(res.body.error.code).toBe("INVALID_INPUT");
      expect(res.body.error.message, query).toContain(message);
    }
  });
});

describe("stored witnesses", () => {
  it("every witness stored for K = 11 passes the engine's independent verifier with its block size and time", async () => {
    await viewer.get("/api/automata/hierarchy?maxBlock=11");
    const stored = await findHierarchy(t.db, { maxBlock: 11, timeMode: "block", radius: 1 });
    const pairs = await hierarchyPairsWithWitnesses(t.db, stored!.id);
    expect(pairs.length).toBeGreaterThan(256);
    const failures = pairs.filter((p) => {
      const { "0": u0, "1": u1 } = p.witness.encoding;
      return u0.length !== p.minBlock || !verifyEmulation(ecaRule(p.source), p.target, u0, u1, p.witness.time).valid;
    });
    expect(failures).toEqual([]);
  });
});

describe("GET /api/automata/rules/:rule", () => {
  it("GET /api/automata/rules/:rule lists what the rule emulates and what emulates it, each with a witness", async () => {
    const res = await viewer.get("/api/automata/rules/18?maxBlock=11");
    expect(res.status).toBe(200);
    expect(res.body.data.rule).toBe(18);
    // rule 18's class under reflection and complement is {18, 183} (18 is its own mirror image)
    expect(res.body.data.symmetryClass).toEqual([18, 183]);
    const toNinety = res.body.data.emulates.find((p: { target: number }) => p.target === 90);
    expect(toNinety).toMatchObject({ source: 18, target: 90, minBlock: 2 });
    expect(res.body.data.emulatedBy.every((p: { target: number }) => p.target === 18)).toBe(true);
  });

  it("GET /api/automata/rules/:rule rejects a number outside 0..255 with 400", async () => {
    for (const bad of ["256", "-1", "x"]) {
      const res = await viewer.get(`/api/automata/rules/${bad}?maxBlock=11`);
      expect(res.status, bad).toBe(400);
      expect(res.body.error.message).toContain("params.rule");
    }
  });
});

describe("GET /api/automata/witness", () => {
  it("GET /api/automata/witness returns the encoding with all eight rows of the definition checked", async () => {
    const res = await viewer.get("/api/automata/witness?source=18&target=90&maxBlock=11");
    expect(res.status).toBe(200);
    expect(res.body.data.verified).toBe(true);
    expect(res.body.data.checks).toHaveLength(8);
    expect(res.body.data.checks.every((c: { agrees: boolean }) => c.agrees)).toBe(true);
    const { "0": u0, "1": u1 } = res.body.data.witness.encoding;
    // rule 90 is left XOR right: the row for 101 must give u0, the row for 100 u1
    expect(res.body.data.checks.find((c: { neighbourhood: string }) => c.neighbourhood === "101")).toMatchObject({
      expectedBit: 0,
      expected: u0,
      obtained: u0,
    });
    expect(res.body.data.checks.find((c: { neighbourhood: string }) => c.neighbourhood === "100")).toMatchObject({
      expectedBit: 1,
      expected: u1,
      obtained: u1,
    });
  });

  it("GET /api/automata/witness answers 404 NO_EMULATION for a pair that does not hold", async () => {
    // rule 0 sends every configuration to all zeros, so it cannot emulate rule 110
    const res = await viewer.get("/api/automata/witness?source=0&target=110&maxBlock=11");
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe("NO_EMULATION");
    expect(res.body.error.message).toBe("Rule 0 does not emulate rule 110 with any block size up to 11");
  });

  it("GET /api/automata/witness rejects a missing or out-of-range rule with 400", async () => {
    const missing = await viewer.get("/api/automata/witness?target=90&maxBlock=11");
    expect(missing.status).toBe(400);
    expect(missing.body.error.message).toContain("query.source: source is required");
    const range = await viewer.get("/api/automata/witness?source=18&target=300&maxBlock=11");
    expect(range.status).toBe(400);
    expect(range.body.error.message).toContain("query.target: target must be at most 255");
  });
});

describe("hierarchies from background runs", () => {
  it("a succeeded eca-hierarchy run's result is filed on the next read, attributed to the run, and reused after", async () => {
    const config = testConfig();
    const log = createLogger(config);
    const worker = await startRunWorker({
      db: t.db,
      log,
      databaseUrl: config.DATABASE_URL,
      mailer: null,
      publicUrl: config.publicUrl,
      settings: { ...loadRunSettings({}, 2), notifyAfterSeconds: 3600 },
    });
    try {
      const modeler = await signInAs(t.app, "modeler@demo.emulant.test");
      const modelerId = (await modeler.get("/api/users/me")).body.data.id as string;
      const started = await modeler
        .post(`/api/projects/${DEMO_PROJECT}/runs`)
        .send({ kind: "eca-hierarchy", params: { maxBlock: 5 } });
      expect(started.status).toBe(201);
      const runId = started.body.data.id as string;
      const deadline = Date.now() + 60_000;
      let state = started.body.data.state as string;
      while (!["succeeded", "failed", "cancelled"].includes(state) && Date.now() < deadline) {
        await new Promise((r) => setTimeout(r, 200));
        state = (await getRun(t.db, runId))!.state;
      }
      expect(state).toBe("succeeded");

      const first = await viewer.get("/api/automata/hierarchy?maxBlock=5");
      expect(first.status).toBe(200);
      expect(first.body.data.computedNow).toBe(false);
      expect(first.body.data.runId).toBe(runId);
      expect(first.body.data.computedBy.id).toBe(modelerId);
      // the run's shards and the inline computation must agree pair for pair
      const inline = computeHierarchyRecord({ maxBlock: 5, timeMode: "block", radius: 1 }, { computedBy: null });
      const stored = await hierarchyPairs(t.db, first.body.data.id);
      expect(stored.map((p) => [p.source, p.target, p.minBlock])).toEqual(
        inline.pairs.map((p) => [p.source, p.target, p.minBlock]),
      );

      const again = await viewer.get("/api/automata/hierarchy?maxBlock=5");
      expect(again.body.data.id).toBe(first.body.data.id);
      const rows = await t.db("eca_hierarchies").where({ max_block: 5 }).count<{ count: string }[]>("* as count");
      expect(Number(rows[0]!.count)).toBe(1);
    } finally {
      await worker.stop();
    }
  });
});
