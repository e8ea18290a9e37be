// Nasty inputs at the API's edges: each answers with a clear 4xx naming the field, never a 500.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { signInAs, type Agent } from "../support/sessions";
import { buildTestApp } from "../support/test-app";

const sent: unknown[] = [];
const t = buildTestApp({ runQueue: { send: async (d) => { sent.push(d); return randomUUID(); }, stop: async () => {} } });
const DEMO = "00000000-0000-4000-8000-000000000001";
const TIDE_CLOCK_MODEL = "00000000-0000-4000-8000-000000000302";
let owner: Agent;

beforeAll(async () => {
  owner = await signInAs(t.app, "owner@demo.emulant.test");
});
afterAll(async () => { await t.close(); });

describe("probe", () => {
  it("probes", async () => {
    const rev = (await t.db("model_revisions").where({ model_id: TIDE_CLOCK_MODEL, revision: 1 }).first()).id;
    const probes: [string, string, unknown?][] = [
      ["post", `/api/projects/${DEMO}/runs`, { kind: "reduction-search", modelRevisionId: rev, params: { search: { mode: "discover", sourceModelId: TIDE_CLOCK_MODEL }, sourceRevisionId: rev, targetRevisionId: null, sourceRuleText: "A' = &&&", targetRuleText: null } }],
      ["post", `/api/projects/${DEMO}/runs`, { kind: "reduction-search", modelRevisionId: rev, params: { search: { mode: "coarse-grain", sourceModelId: TIDE_CLOCK_MODEL, observe: ["A"] }, sourceRevisionId: randomUUID(), targetRevisionId: null, sourceRuleText: "A' = B\nB' = A\n", targetRuleText: null } }],
      ["post", `/api/projects/${DEMO}/runs`, { kind: "attractors", params: { ruleText: "A' = &&&" } }],
      ["post", `/api/projects/${DEMO}/runs`, { kind: "sleep-count", params: { itemCount: 1e9, shardCount: 64, delayMsPerItem: 1000 } }],
      ["post", `/api/projects/${DEMO}/runs`, { kind: "eca-hierarchy", params: { maxBlock: 99 } }],
    ];
    for (const [m, url, body] of probes) {
      const req = (owner as any)[m](url);
      const res = body === undefined ? await req : typeof body === "string" ? await req.set("Content-Type", "application/json").send(JSON.stringify(body)) : await req.send(body);
      console.log(res.status, m.toUpperCase(), url.slice(0, 110), JSON.stringify(res.body?.error ?? res.body?.data ?? res.text).slice(0, 200));
    }
  }, 120_000);
});
