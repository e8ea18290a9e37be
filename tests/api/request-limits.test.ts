// The request path stays cheap whatever one caller sends: documented limits answer 4xx with a code before any work,
// answers stay bounded, and heavy reading happens in the interactive pool while the event loop keeps answering.
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MAX_REPORTED_ERRORS } from "@shared/engine/rules";
import { MODEL_UPLOAD_LIMIT_BYTES } from "@shared/schemas/models";
import { TRAJECTORY_MAX_CELLS } from "../../server/services/models/revision-analyses";
import { closeInteractivePool } from "../../server/workers/interactive-pool";
import { signInAs, type Agent } from "../support/sessions";
import { buildTestApp } from "../support/test-app";

const t = buildTestApp();
const PROJECT = "00000000-0000-4000-8000-000000000001";
const base = `/api/projects/${PROJECT}/models`;
let modeler: Agent;
let viewer: Agent;

beforeAll(async () => {
  modeler = await signInAs(t.app, "modeler@demo.emulant.test");
  viewer = await signInAs(t.app, "viewer@demo.emulant.test");
});

afterAll(async () => {
  await closeInteractivePool();
  await t.close();
});

/** 20,000 nodes reading ten regulators each: valid text whose truth tables take the reader seconds to build. */
function heavyRuleText(): string {
  const n = 20_000;
  return Array.from(
    { length: n },
    (_, i) => `N${i}' = ${Array.from({ length: 10 }, (_, k) => `N${(i + k + 1) % n}`).join(" & ")}`,
  ).join("\n");
}

describe("request limits", () => {
  it("POST /models/validate with a body over the JSON limit answers 413 TOO_LARGE", async () => {
    const res = await viewer
      .post(`${base}/validate`)
      .set("content-type", "application/json")
      .send(JSON.stringify({ ruleText: "x".repeat(6 * 1024 * 1024) }));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe("TOO_LARGE");
  });

  it("POST /models/upload with a file over the upload limit answers 413 TOO_LARGE and stores nothing", async () => {
    const before = await t.db("models").count<{ count: string }[]>("* as count");
    const res = await modeler
      .post(`${base}/upload`)
      .attach("file", Buffer.alloc(MODEL_UPLOAD_LIMIT_BYTES + 1024, "0,1\n"), "big.csv");
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe("TOO_LARGE");
    const after = await t.db("models").count<{ count: string }[]>("* as count");
    expect(after[0]!.count).toBe(before[0]!.count);
  });

  it("POST /models/validate of 300,000 broken lines answers at most the first errors, in a small body", async () => {
    const res = await viewer.post(`${base}/validate`).send({ ruleText: "A' = \n".repeat(300_000) });
    expect(res.status).toBe(200);
    expect(res.body.data.ok).toBe(false);
    expect(res.body.data.errors.length).toBeGreaterThan(0);
    expect(res.body.data.errors.length).toBeLessThanOrEqual(MAX_REPORTED_ERRORS);
    expect(res.text.length).toBeLessThan(64 * 1024);
  });

  it("GET /api/health answers while a heavy POST /models/validate is still being read", async () => {
    const finished: string[] = [];
    const validate = viewer
      .post(`${base}/validate`)
      .send({ ruleText: heavyRuleText() })
      .then((res) => {
        finished.push("validate");
        return res;
      });
    // Give the request time to arrive and be handed to the pool, then ask for health.
    await new Promise((r) => setTimeout(r, 300));
    const health = await request(t.app).get("/api/health");
    finished.push("health");
    expect(health.status).toBe(200);
    const res = await validate;
    expect(res.status).toBe(200);
    expect(res.body.data.nodeCount).toBe(20_000);
    expect(finished).toEqual(["health", "validate"]);
  }, 60_000);

  it("POST /trajectory asking for more node values than the limit answers 422 LIMIT_EXCEEDED before any work", async () => {
    const n = 2100;
    const ruleText = Array.from({ length: n }, (_, i) => `M${i}' = M${(i + 1) % n}`).join("\n");
    const created = await modeler.post(base).send({ name: "Long ring for the trajectory limit", ruleText });
    expect(created.status).toBe(201);
    const id = created.body.data.model.id as string;
    const res = await viewer
      .post(`${base}/${id}/revisions/1/trajectory`)
      .send({ initial: "0".repeat(n), steps: 1000, scheme: "synchronous" });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe("LIMIT_EXCEEDED");
    expect(res.body.error.details).toMatchObject({ max: TRAJECTORY_MAX_CELLS });
    const within = await viewer
      .post(`${base}/${id}/revisions/1/trajectory`)
      .send({ initial: "1".repeat(n), steps: 10, scheme: "synchronous" });
    expect(within.status).toBe(200);
    expect(within.body.data.states).toHaveLength(11);
  }, 60_000);
});
