// Personal access tokens through the API: shown once and stored as a hash, last use recorded, expiry and revocation
// end them, a project list limits them, and a token never reaches further than its owner.
import request from "supertest";
import { afterAll, describe, expect, it } from "vitest";
import { hashAccessToken } from "../../server/db/repositories/access-tokens";
import { signUpFresh } from "../support/sessions";
import { buildTestApp } from "../support/test-app";

const t = buildTestApp();
afterAll(() => t.close());

async function personWithProjects() {
  const person = await signUpFresh(t.app, "scripter");
  const a = await person.agent.post("/api/projects").send({ name: "Token project A" });
  const b = await person.agent.post("/api/projects").send({ name: "Token project B" });
  return { ...person, projectA: a.body.data.id as string, projectB: b.body.data.id as string };
}

const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

describe("personal access tokens", () => {
  it("POST /api/users/me/tokens shows the secret once, stores only its hash, and records the last use", async () => {
    const p = await personWithProjects();
    const created = await p.agent
      .post("/api/users/me/tokens")
      .send({ name: "notebook", scope: "read", expiresInDays: 30 });
    expect(created.status).toBe(201);
    const { token, id } = created.body.data as { token: string; id: string };
    expect(token).toMatch(/^emu_/);
    const row = await t.db("access_tokens").where({ id }).first();
    expect(row.token_hash).toBe(hashAccessToken(token));
    expect(JSON.stringify(row)).not.toContain(token);

    const before = await p.agent.get("/api/users/me/tokens");
    expect(before.body.data[0]).toMatchObject({ id, lastUsedAt: null });
    expect(before.body.data[0]).not.toHaveProperty("token");

    const me = await request(t.app).get("/api/users/me").set(bearer(token));
    expect(me.status).toBe(200);
    expect(me.body.data.email).toBe(p.email);
    const after = await p.agent.get("/api/users/me/tokens");
    expect(after.body.data[0].lastUsedAt).not.toBeNull();
  });

  it("a revoked or expired token answers 401 TOKEN_INVALID, as does a made-up one", async () => {
    const p = await personWithProjects();
    const make = async () =>
      (await p.agent.post("/api/users/me/tokens").send({ name: "t", scope: "write", expiresInDays: 1 })).body.data as {
        token: string;
        id: string;
      };
    const revoked = await make();
    expect((await p.agent.delete(`/api/users/me/tokens/${revoked.id}`)).status).toBe(204);
    expect((await p.agent.delete(`/api/users/me/tokens/${revoked.id}`)).status).toBe(404);
    const expired = await make();
    await t
      .db("access_tokens")
      .where({ id: expired.id })
      .update({ expires_at: new Date(Date.now() - 1000) });
    for (const token of [revoked.token, expired.token, "emu_made-up"]) {
      const res = await request(t.app).get("/api/projects").set(bearer(token));
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe("TOKEN_INVALID");
    }
    // A cookie does not rescue a request whose token is dead: the token alone is judged.
    const withCookie = await p.agent.get("/api/projects").set(bearer(revoked.token));
    expect(withCookie.status).toBe(401);
  });

  it("a token limited to one project lists and reaches only that project, and cannot create projects", async () => {
    const p = await personWithProjects();
    const created = await p.agent
      .post("/api/users/me/tokens")
      .send({ name: "only A", scope: "write", expiresInDays: 7, projectIds: [p.projectA] });
    const { token } = created.body.data as { token: string };
    const list = await request(t.app).get("/api/projects").set(bearer(token));
    expect(list.body.data.map((x: { id: string }) => x.id)).toEqual([p.projectA]);
    expect((await request(t.app).get(`/api/projects/${p.projectA}/models`).set(bearer(token))).status).toBe(200);
    const other = await request(t.app).get(`/api/projects/${p.projectB}/models`).set(bearer(token));
    expect(other.status).toBe(403);
    expect(other.body.error.code).toBe("TOKEN_NOT_ALLOWED");
    const create = await request(t.app).post("/api/projects").set(bearer(token)).send({ name: "Not allowed" });
    expect(create.status).toBe(403);
  });

  it("creating and revoking a token is written to the audit log of each project it reaches, and only those", async () => {
    const p = await personWithProjects();
    const actions = async (projectId: string) =>
      ((await p.agent.get(`/api/projects/${projectId}/audit`)).body.data as { action: string; target: string }[])
        .filter((e) => e.action.startsWith("token."))
        .map((e) => `${e.action} ${e.target}`);
    const onlyA = await p.agent
      .post("/api/users/me/tokens")
      .send({ name: "only A", scope: "read", expiresInDays: 7, projectIds: [p.projectA] });
    const everywhere = await p.agent
      .post("/api/users/me/tokens")
      .send({ name: "all mine", scope: "write", expiresInDays: 7 });
    expect((await p.agent.delete(`/api/users/me/tokens/${onlyA.body.data.id}`)).status).toBe(204);
    expect(everywhere.status).toBe(201);
    expect(await actions(p.projectA)).toEqual(["token.revoke only A", "token.create all mine", "token.create only A"]);
    expect(await actions(p.projectB)).toEqual(["token.create all mine"]);
  });

  it("POST /api/users/me/tokens refuses projects the person is not in, naming the field, and bad scopes", async () => {
    const p = await personWithProjects();
    const stranger = await personWithProjects();
    const res = await p.agent
      .post("/api/users/me/tokens")
      .send({ name: "x", scope: "write", expiresInDays: 7, projectIds: [p.projectA, stranger.projectA] });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([
      { field: "body.projectIds.1", message: "You are not a member of this project" },
    ]);
    const scope = await p.agent.post("/api/users/me/tokens").send({ name: "x", scope: "admin", expiresInDays: 7 });
    expect(scope.status).toBe(400);
    expect(scope.body.error.details[0].field).toBe("body.scope");
  });

  it("a read token may read and compute but not change a project; a write token may", async () => {
    const p = await personWithProjects();
    const tokenOf = async (scope: "read" | "write") =>
      (await p.agent.post("/api/users/me/tokens").send({ name: scope, scope, expiresInDays: 7 })).body.data
        .token as string;
    const read = await tokenOf("read");
    const write = await tokenOf("write");
    const model = { name: "Toggle", ruleText: "A' = !B\nB' = !A\n" };
    const refused = await request(t.app).post(`/api/projects/${p.projectA}/models`).set(bearer(read)).send(model);
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe("TOKEN_NOT_ALLOWED");
    const validate = await request(t.app)
      .post(`/api/projects/${p.projectA}/models/validate`)
      .set(bearer(read))
      .send({ ruleText: model.ruleText });
    expect(validate.status).toBe(200);
    const made = await request(t.app).post(`/api/projects/${p.projectA}/models`).set(bearer(write)).send(model);
    expect(made.status).toBe(201);
  });
});
