// The project's "last change" follows work inside the project, not only edits to the project's own name.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { signInAs } from "../support/sessions";
import { buildTestApp } from "../support/test-app";

const t = buildTestApp();
afterAll(() => t.close());

const PROJECT = "00000000-0000-4000-8000-000000000001";

type Agent = Awaited<ReturnType<typeof signInAs>>;
let modeler: Agent;
let viewer: Agent;

beforeAll(async () => {
  modeler = await signInAs(t.app, "modeler@demo.emulant.test");
  viewer = await signInAs(t.app, "viewer@demo.emulant.test");
});

async function lastChange(): Promise<number> {
  const res = await viewer.get(`/api/projects/${PROJECT}`);
  expect(res.status).toBe(200);
  return Date.parse(res.body.data.updatedAt);
}

describe("GET /projects/:projectId updatedAt", () => {
  it("moves forward when a model is created and again when it gets a revision", async () => {
    const before = await lastChange();
    const created = await modeler
      .post(`/api/projects/${PROJECT}/models`)
      .send({ name: "Last-change toggle", ruleText: "A' = !B\nB' = !A\n" });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const afterCreate = await lastChange();
    expect(afterCreate).toBeGreaterThan(before);

    const revised = await modeler
      .post(`/api/projects/${PROJECT}/models/${created.body.data.model.id}/revisions`)
      .send({ ruleText: "A' = !B\nB' = A\n", message: "B follows A" });
    expect(revised.status, JSON.stringify(revised.body)).toBe(201);
    expect(await lastChange()).toBeGreaterThan(afterCreate);
  });

  it("gives the project list the same last change as the project itself", async () => {
    const list = await viewer.get("/api/projects");
    expect(list.status).toBe(200);
    const row = list.body.data.find((p: { id: string }) => p.id === PROJECT);
    expect(Date.parse(row.updatedAt)).toBe(await lastChange());
  });
});
