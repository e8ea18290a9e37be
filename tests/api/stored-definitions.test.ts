// Revisions stored before rule trees held their operator chains flat keep binary nodes ({ kind, left, right }) in
// model_revisions.definition. Such a row, written here as the old code wrote it, must still analyse and export.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { signInAs } from "../support/sessions";
import { buildTestApp } from "../support/test-app";

const t = buildTestApp();
afterAll(() => t.close());

const PROJECT = "00000000-0000-4000-8000-000000000001";
const base = `/api/projects/${PROJECT}/models`;
let modeler: Awaited<ReturnType<typeof signInAs>>;

beforeAll(async () => {
  modeler = await signInAs(t.app, "modeler@demo.emulant.test");
});

const v = (name: string) => ({ kind: "var", name });
// P' = !Q & R & !R | Q, Q' = P ^ Q ^ R, R' = R, as binary left chains (the old parser's trees).
const BINARY_DEFINITION = {
  nodes: [
    {
      name: "P",
      rule: {
        kind: "or",
        left: {
          kind: "and",
          left: { kind: "and", left: { kind: "not", arg: v("Q") }, right: v("R") },
          right: { kind: "not", arg: v("R") },
        },
        right: v("Q"),
      },
    },
    { name: "Q", rule: { kind: "xor", left: { kind: "xor", left: v("P"), right: v("Q") }, right: v("R") } },
    { name: "R", rule: v("R") },
  ],
};

describe("revisions stored with binary operator nodes", () => {
  it("GET export and attractors read an old binary definition as the flat rules it stands for", async () => {
    const created = await modeler
      .post(base)
      .send({ name: "Stored before flat chains", ruleText: "P' = Q\nQ' = P\nR' = R\n" });
    expect(created.status).toBe(201);
    const modelId = created.body.data.model.id as string;
    const revision = await t.db("model_revisions").where({ model_id: modelId, revision: 1 }).first("created_by");
    await t.db.transaction(async (trx) => {
      await trx("model_revisions").insert({
        model_id: modelId,
        revision: 2,
        definition: JSON.stringify(BINARY_DEFINITION),
        rule_text: "P' = !Q & R & !R | Q\nQ' = P ^ Q ^ R\nR' = R\n",
        network_summary: JSON.stringify({ nodes: ["P", "Q", "R"], edgeCount: 6, inputs: ["R"], thresholdNodes: [] }),
        node_count: 3,
        source: "edit",
        created_by: (revision as { created_by: string }).created_by,
      });
      await trx("models").where({ id: modelId }).update({ latest_revision: 2 });
    });
    const exported = await modeler.get(`${base}/${modelId}/revisions/2/export?format=rules`).buffer(true);
    expect(exported.status).toBe(200);
    expect(exported.text).toBe("P' = !Q & R & !R | Q\nQ' = P ^ Q ^ R\nR' = R\n");
    const attractors = await modeler.get(`${base}/${modelId}/revisions/2/attractors`);
    expect(attractors.status).toBe(200);
    expect(attractors.body.data.stateCount).toBe(8);
  });
});
