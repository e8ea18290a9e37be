// Nasty input at the API's edges: each gets a 4xx that names what is wrong, never a 500, and nothing is stored.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { networkToCertificate } from "@shared/engine/certificates";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { signInAs, type Agent } from "../support/sessions";
import { buildTestApp } from "../support/test-app";

// Jobs are only recorded: no request here should ever reach the queue.
const sent: unknown[] = [];
const t = buildTestApp({
  runQueue: {
    send: async (job) => {
      sent.push(job);
      return randomUUID();
    },
    stop: async () => {},
  },
});
const projectName = `API edges ${randomUUID().slice(0, 8)}`;
let owner: Agent;
let projectId: string;
let base: string;

beforeAll(async () => {
  owner = await signInAs(t.app, "owner@demo.emulant.test");
  const res = await owner.post("/api/projects").send({ name: projectName });
  expect(res.status).toBe(201);
  projectId = res.body.data.id;
  base = `/api/projects/${projectId}`;
});
afterAll(async () => {
  await owner.delete(base).send({ confirmName: projectName });
  await t.close();
});

async function createModel(name: string, ruleText: string): Promise<{ modelId: string; revisionId: string }> {
  const res = await owner.post(`${base}/models`).send({ name, ruleText });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { modelId: res.body.data.model.id, revisionId: res.body.data.revision.id };
}

describe("POST /runs", () => {
  it("refuses a reduction-search run whose parameters the client assembled, and starts nothing", async () => {
    const { modelId, revisionId } = await createModel("Toggle", "A' = !B\nB' = A\n");
    const forged = (sourceRuleText: string, sourceRevisionId: string) => ({
      kind: "reduction-search",
      modelRevisionId: revisionId,
      params: {
        search: { mode: "discover", sourceModelId: modelId },
        sourceRevisionId,
        targetRevisionId: null,
        sourceRuleText,
        targetRuleText: null,
      },
    });
    // Unparsable rule text used to escape as a 500; a foreign revision id used to be accepted and trusted later.
    for (const body of [forged("A' = &&&", revisionId), forged("A' = B\nB' = A\n", randomUUID())]) {
      const res = await owner.post(`${base}/runs`).send(body);
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.error.code).toBe("INVALID_INPUT");
      expect(res.body.error.message).toMatch(/^body\.kind: .*reductions\/searches/);
    }
    expect((await owner.get(`${base}/runs`)).body.data).toEqual([]);
    expect(sent).toEqual([]);
  });
});

describe("POST /models and /models/validate", () => {
  // 80 nodes reading 20 others each: 80 * 2^20 truth-table rows, about 80 MB built while the request waits.
  const names = Array.from({ length: 80 }, (_, i) => `G${i}`);
  const wide = names
    .map(
      (n, i) => `${n}' = ` + Array.from({ length: 20 }, (_, j) => names[(i + j + 1) % names.length]).join(" & ") + "\n",
    )
    .join("");

  it("refuses rule text whose truth tables would exceed 2^26 rows in all, naming the node and its line", async () => {
    const res = await owner.post(`${base}/models/validate`).send({ ruleText: wide });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.data.ok).toBe(false);
    expect(res.body.data.errors).toEqual([
      {
        line: 65,
        column: 1,
        message: expect.stringMatching(/^up to node G64 the truth tables already have more than 2\^26 rows/),
      },
    ]);
  });

  it("answers 400 PARSE_ERROR when such a model is created, and stores nothing", async () => {
    const before = (await owner.get(`${base}/models`)).body.data.length;
    const res = await owner.post(`${base}/models`).send({ name: "Too wide", ruleText: wide });
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(res.body.error.code).toBe("PARSE_ERROR");
    expect((await owner.get(`${base}/models`)).body.data.length).toBe(before);
  });
});

describe("POST /models/upload", () => {
  it("answers 400 for a truncated or boundary-less multipart body, and stores nothing", async () => {
    const before = (await owner.get(`${base}/models`)).body.data.length;
    const truncated = '--XYZ\r\nContent-Disposition: form-data; name="file"; filename="a.rules"\r\n\r\nA\' = A\r\n';
    for (const [type, body] of [
      ["multipart/form-data; boundary=XYZ", truncated],
      ["multipart/form-data", "garbage"],
    ]) {
      const res = await owner.post(`${base}/models/upload`).set("Content-Type", type!).send(body);
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.error.message).toMatch(/^Upload refused: the form data could not be read/);
    }
    expect((await owner.get(`${base}/models`)).body.data.length).toBe(before);
  });
});

describe("POST /runs (attractors with rule text)", () => {
  it("answers 400 PARSE_ERROR with line and column for unreadable rule text, and starts nothing", async () => {
    const before = (await owner.get(`${base}/runs`)).body.data.length;
    const res = await owner
      .post(`${base}/runs`)
      .send({ kind: "attractors", params: { ruleText: "A' = B\nB' = A &&& \n" } });
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(res.body.error.code).toBe("PARSE_ERROR");
    expect(res.body.error.message).toMatch(/^params\.ruleText: .* \(line 2, column \d+\)$/);
    expect((await owner.get(`${base}/runs`)).body.data.length).toBe(before);
  });
});

describe("GET /models/:modelId/revisions/:revision", () => {
  it("answers 400 naming params.revision for a revision number beyond what can be stored", async () => {
    const { modelId } = await createModel("Ring", "A' = B\nB' = A\n");
    const res = await owner.get(`${base}/models/${modelId}/revisions/2147483648`);
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(res.body.error.message).toMatch(/^params\.revision: /);
  });
});

describe("PATCH /users/me", () => {
  it("answers 400 for a display name with a NUL character and keeps the stored name", async () => {
    const before = (await owner.get("/api/users/me")).body.data.displayName;
    const res = await owner.patch("/api/users/me").send({ displayName: "Nul\u0000name" });
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(res.body.error.code).toBe("INVALID_INPUT");
    expect((await owner.get("/api/users/me")).body.data.displayName).toBe(before);
  });
});

describe("POST /reductions (certificate upload)", () => {
  it("refuses a certificate whose target has more than 12 nodes before verifying it, and stores nothing", async () => {
    const names = Array.from({ length: 13 }, (_, i) => `X${i}`);
    const ruleText = names.map((n) => `${n}' = ${n}\n`).join("");
    const { modelId } = await createModel("Thirteen holds", ruleText);
    const net = networkToCertificate(compileDefinition(readRuleText(ruleText)));
    // A valid identity emulation; its cost grows as 2^(target nodes) and it would be checked inside the request.
    const certificate = {
      format: "emulant-reduction",
      version: 1,
      notion: "block-emulation",
      time: 1,
      source: net,
      target: net,
      witness: { blocks: names.map((n) => ({ target: n, nodes: [n], zero: "0", one: "1" })), context: {} },
    };
    const res = await owner.post(`${base}/reductions`).send({ sourceModelId: modelId, certificate });
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(res.body.error.code).toBe("TOO_LARGE");
    expect(res.body.error.message).toMatch(/^certificate\.target: it has 13 nodes/);
    expect((await owner.get(`${base}/reductions`)).body.data).toEqual([]);
  });
});
