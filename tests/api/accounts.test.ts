// Accounts, sessions, projects, memberships and invitations through the HTTP API against the real database.
import { randomUUID } from "node:crypto";
import request from "supertest";
import { afterAll, describe, expect, it } from "vitest";
import { SESSION_COOKIE } from "../../server/http/session";
import { sessionCookieFor, signInAs, signUpFresh, signUpLinkToken, type Agent } from "../support/sessions";
import { buildTestApp, testConfig } from "../support/test-app";

const t = buildTestApp();
const config = testConfig();
afterAll(() => t.close());

const uniqueEmail = (label: string) => `${label}-${randomUUID().slice(0, 8)}@fixture.emulant.test`;

function sessionCookie(res: request.Response): string | undefined {
  const raw = res.headers["set-cookie"] as unknown as string[] | undefined;
  return raw?.find((c) => c.startsWith(`${SESSION_COOKIE}=`));
}

async function userCount(): Promise<number> {
  const row = await t.db("users").count<{ count: string }[]>("* as count").first();
  return Number(row?.count);
}

async function newProject(
  agent: Agent,
  name = `Project ${randomUUID().slice(0, 8)}`,
): Promise<{ id: string; name: string }> {
  const res = await agent.post("/api/projects").send({ name });
  expect(res.status).toBe(201);
  return { id: res.body.data.id, name: res.body.data.name };
}

/** Invites by e-mail and returns the token read back from the mail the local SMTP fake stored. */
async function invite(agent: Agent, projectId: string, email: string, role: string): Promise<string> {
  const res = await agent.post(`/api/projects/${projectId}/invitations`).send({ email, role });
  expect(res.status).toBe(201);
  const mail = await t.db("mail_messages").whereRaw("? = any(mail_to)", [email]).orderBy("received_at", "desc").first();
  const token = /\/invitations\/([A-Za-z0-9_-]+)/.exec(mail.text_body)?.[1];
  expect(token).toBeTruthy();
  return token!;
}

describe("POST /api/auth/sign-up and /sign-up/confirm", () => {
  it("mails a one-time link; opening it creates the account with an scrypt hash and an httpOnly SameSite=Lax session", async () => {
    const email = uniqueEmail("signup");
    const agent = request.agent(t.app);
    const asked = await agent
      .post("/api/auth/sign-up")
      .send({ email: email.toUpperCase(), displayName: "  Lena Brightwater ", password: "long-enough-password" });
    expect(asked.status).toBe(202);
    expect(asked.body.data).toEqual({ email });
    expect(sessionCookie(asked)).toBeUndefined();
    expect(await t.db("users").where({ email }).first()).toBeUndefined();
    const token = await signUpLinkToken(t.app, email);
    const res = await agent.post("/api/auth/sign-up/confirm").send({ token });
    expect(res.status).toBe(201);
    expect(res.body.data).toMatchObject({ email, displayName: "Lena Brightwater", siteRole: "member" });
    const cookie = sessionCookie(res)!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Max-Age=28800/);
    const row = await t.db("users").where({ email }).first();
    expect(row.password_hash).toMatch(/^scrypt\$32768\$8\$1\$/);
    expect(row.password_hash).not.toContain("long-enough-password");
    const session = await agent.get("/api/auth/session");
    expect(session.body.data.user.email).toBe(email);
    // The link works once.
    const again = await request(t.app).post("/api/auth/sign-up/confirm").send({ token });
    expect(again.status).toBe(404);
    expect(again.body.error.code).toBe("SIGN_UP_LINK_INVALID");
  });

  it("answers a known address exactly as a new one, changes nothing, and tells the owner by e-mail", async () => {
    const { email } = await signUpFresh(t.app, "taken");
    const before = await t.db("users").where({ email }).first();
    const known = await request(t.app)
      .post("/api/auth/sign-up")
      .send({ email, displayName: "Second", password: "long-enough-password" });
    const fresh = await request(t.app)
      .post("/api/auth/sign-up")
      .send({ email: uniqueEmail("new"), displayName: "Second", password: "long-enough-password" });
    expect(known.status).toBe(fresh.status);
    expect(Object.keys(known.body.data)).toEqual(Object.keys(fresh.body.data));
    expect(known.body.data.email).toBe(email);
    expect(await t.db("users").where({ email }).first()).toEqual(before);
    const mail = await t
      .db("mail_messages")
      .whereRaw("? = any(mail_to)", [email])
      .orderBy("received_at", "desc")
      .first();
    expect(mail.subject).toBe("Someone asked to create an Emulant account with your address");
    expect(mail.text_body).not.toMatch(/sign-up\/finish/);
  });

  it("refuses an expired link", async () => {
    const email = uniqueEmail("late");
    await request(t.app)
      .post("/api/auth/sign-up")
      .send({ email, displayName: "Late", password: "long-enough-password" });
    const token = await signUpLinkToken(t.app, email);
    await t
      .db("sign_up_requests")
      .where({ email })
      .update({ expires_at: new Date(Date.now() - 1000) });
    const res = await request(t.app).post("/api/auth/sign-up/confirm").send({ token });
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe("SIGN_UP_LINK_INVALID");
    expect(await t.db("users").where({ email }).first()).toBeUndefined();
  });

  it("limits sign-up requests per client address with 429 RATE_LIMITED", async () => {
    const limited = buildTestApp({ signUpLimits: { windowMs: 60_000, perAddress: 2 } });
    try {
      const ask = () =>
        request(limited.app)
          .post("/api/auth/sign-up")
          .send({ email: uniqueEmail("burst"), displayName: "Burst", password: "long-enough-password" });
      expect((await ask()).status).toBe(202);
      expect((await ask()).status).toBe(202);
      const third = await ask();
      expect(third.status).toBe(429);
      expect(third.body.error.code).toBe("RATE_LIMITED");
    } finally {
      await limited.close();
    }
  });

  it.each([
    ["an over-long name", { displayName: "x".repeat(121) }, "body.displayName"],
    ["a malformed e-mail", { email: "not-an-address" }, "body.email"],
    ["SQL metacharacters in the e-mail", { email: "x'); drop table users; --@example.org" }, "body.email"],
    ["a short password", { password: "short" }, "body.password"],
  ])("refuses %s with 400 INVALID_INPUT naming the field and creates nothing", async (_label, override, field) => {
    const before = await userCount();
    const res = await request(t.app)
      .post("/api/auth/sign-up")
      .send({ email: uniqueEmail("bad"), displayName: "Valid Name", password: "long-enough-password", ...override });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("INVALID_INPUT");
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
    expect(await userCount()).toBe(before);
  });

  it("stores a name full of SQL metacharacters verbatim, without touching anything else", async () => {
    const name = `Robert'); DROP TABLE users; -- "quoted" \\ %_`;
    const { agent } = await signUpFresh(t.app, "bobby");
    const res = await agent.patch("/api/users/me").send({ displayName: name });
    expect(res.status).toBe(200);
    expect((await agent.get("/api/users/me")).body.data.displayName).toBe(name);
    expect(await userCount()).toBeGreaterThan(1);
  });
});

describe("POST /api/auth/sign-in and sign-out", () => {
  it("signs in the demo owner and signs out, after which the profile answers 401", async () => {
    const agent = await signInAs(t.app, "owner@demo.emulant.test");
    expect((await agent.get("/api/users/me")).status).toBe(200);
    const out = await agent.post("/api/auth/sign-out");
    expect(out.status).toBe(204);
    expect(sessionCookie(out)).toMatch(/Expires=Thu, 01 Jan 1970/);
    expect((await agent.get("/api/users/me")).status).toBe(401);
  });

  it("ends the session on the server: a copy of the token kept from before sign-out no longer works", async () => {
    const res = await request(t.app)
      .post("/api/auth/sign-in")
      .send({ email: "viewer@demo.emulant.test", password: "demo-password" });
    const copy = sessionCookie(res)!.split(";")[0]!;
    expect((await request(t.app).get("/api/users/me").set("Cookie", copy)).status).toBe(200);
    expect((await request(t.app).post("/api/auth/sign-out").set("Cookie", copy)).status).toBe(204);
    const after = await request(t.app).get("/api/users/me").set("Cookie", copy);
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe("UNAUTHENTICATED");
  });

  it("answers a wrong password and an unknown address with the same 401 INVALID_CREDENTIALS and no cookie", async () => {
    const wrong = await request(t.app)
      .post("/api/auth/sign-in")
      .send({ email: "owner@demo.emulant.test", password: "wrong-password" });
    const unknown = await request(t.app)
      .post("/api/auth/sign-in")
      .send({ email: uniqueEmail("nobody"), password: "wrong-password" });
    for (const res of [wrong, unknown]) {
      expect(res.status).toBe(401);
      expect(res.body.error).toEqual({ code: "INVALID_CREDENTIALS", message: "Wrong e-mail address or password" });
      expect(sessionCookie(res)).toBeUndefined();
    }
  });

  it("does not let an SQL-injection password through", async () => {
    const res = await request(t.app)
      .post("/api/auth/sign-in")
      .send({ email: "owner@demo.emulant.test", password: "' OR '1'='1" });
    expect(res.status).toBe(401);
  });
});

describe("sessions", () => {
  it("rotates a token older than an hour and keeps the person signed in", async () => {
    const { id } = await signUpFresh(t.app, "rotate");
    const twoHoursAgo = Math.floor(Date.now() / 1000) - 2 * 3600;
    const old = await sessionCookieFor(t.db, config.sessionSecret, id, { issuedAt: twoHoursAgo });
    const res = await request(t.app).get("/api/users/me").set("Cookie", old);
    expect(res.status).toBe(200);
    const fresh = sessionCookie(res);
    expect(fresh).toBeDefined();
    expect(fresh).not.toContain(old);
  });

  it("does not rotate a young token", async () => {
    const { id } = await signUpFresh(t.app, "young");
    const cookie = await sessionCookieFor(t.db, config.sessionSecret, id);
    const res = await request(t.app).get("/api/users/me").set("Cookie", cookie);
    expect(res.status).toBe(200);
    expect(sessionCookie(res)).toBeUndefined();
  });

  it("treats an expired (9 hours old) or forged token as anonymous", async () => {
    const { id } = await signUpFresh(t.app, "expired");
    const expired = await sessionCookieFor(t.db, config.sessionSecret, id, {
      issuedAt: Math.floor(Date.now() / 1000) - 9 * 3600,
    });
    const forged = await sessionCookieFor(t.db, "some-other-secret-that-is-long-enough-000", id);
    for (const cookie of [expired, forged, `${SESSION_COOKIE}=not.a.jwt`]) {
      const res = await request(t.app).get("/api/users/me").set("Cookie", cookie);
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe("UNAUTHENTICATED");
    }
  });

  it("ends other sessions when the password changes, and refuses a wrong current password", async () => {
    const { agent, email } = await signUpFresh(t.app, "pwchange");
    const other = await signInAs(t.app, email);
    const wrong = await agent
      .post("/api/users/me/password")
      .send({ currentPassword: "not-my-password", newPassword: "a-new-password-1" });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.code).toBe("WRONG_PASSWORD");
    const ok = await agent
      .post("/api/users/me/password")
      .send({ currentPassword: "demo-password", newPassword: "a-new-password-1" });
    expect(ok.status).toBe(200);
    expect((await agent.get("/api/users/me")).status).toBe(200);
    expect((await other.get("/api/users/me")).status).toBe(401);
    await signInAs(t.app, email, "a-new-password-1");
  });
});

describe("sign-in throttling", () => {
  const throttle = { freeFailures: 2, baseDelayMs: 60_000, maxDelayMs: 600_000, forgetAfterMs: 900_000 };

  it("makes further attempts on one account from one address wait, says how long, and still lets other accounts in", async () => {
    const limited = buildTestApp({ signInLimits: { windowMs: 60_000, perAddress: 100, throttle } });
    try {
      const { email } = await signUpFresh(limited.app, "throttle");
      for (let i = 0; i < 3; i++) {
        // X-Forwarded-For is not trusted without TRUST_PROXY, so changing it does not make a new address.
        const res = await request(limited.app)
          .post("/api/auth/sign-in")
          .set("X-Forwarded-For", `203.0.113.${i + 1}`)
          .send({ email, password: "wrong-password" });
        expect(res.status).toBe(401);
      }
      const blocked = await request(limited.app).post("/api/auth/sign-in").send({ email, password: "demo-password" });
      expect(blocked.status).toBe(429);
      expect(blocked.body.error.code).toBe("RATE_LIMITED");
      expect(blocked.body.error.message).toBe(
        "Too many failed sign-in attempts for this account from your address. Wait 1 minute and try again.",
      );
      expect(Number(blocked.headers["retry-after"])).toBeGreaterThan(50);
      const other = await signUpFresh(limited.app, "throttle-other");
      expect(
        (await request(limited.app).post("/api/auth/sign-in").send({ email: other.email, password: "demo-password" }))
          .status,
      ).toBe(200);
    } finally {
      await limited.close();
    }
  });

  it("refuses an address that fails on many accounts", async () => {
    const limited = buildTestApp({ signInLimits: { windowMs: 60_000, perAddress: 3, throttle } });
    try {
      for (let i = 0; i < 3; i++) {
        expect(
          (
            await request(limited.app)
              .post("/api/auth/sign-in")
              .send({ email: uniqueEmail("spray"), password: "wrong-password" })
          ).status,
        ).toBe(401);
      }
      const blocked = await request(limited.app)
        .post("/api/auth/sign-in")
        .send({ email: "owner@demo.emulant.test", password: "demo-password" });
      expect(blocked.status).toBe(429);
      expect(blocked.body.error.code).toBe("RATE_LIMITED");
    } finally {
      await limited.close();
    }
  });
});

describe("Origin check", () => {
  it("refuses a state-changing request from a foreign Origin with 403 BAD_ORIGIN and changes nothing", async () => {
    const agent = await signInAs(t.app, "owner@demo.emulant.test");
    const name = `Cross-site ${randomUUID().slice(0, 8)}`;
    const res = await agent.post("/api/projects").set("Origin", "https://evil.example").send({ name });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("BAD_ORIGIN");
    expect(await t.db("projects").where({ name }).first()).toBeUndefined();
  });

  it("allows the site's own Origin and reads from any Origin", async () => {
    const agent = await signInAs(t.app, "owner@demo.emulant.test");
    const own = await agent
      .post("/api/projects")
      .set("Host", "emulant.local:8080")
      .set("Origin", "http://emulant.local:8080")
      .send({ name: "Same-site project" });
    expect(own.status).toBe(201);
    const read = await agent.get("/api/projects").set("Origin", "https://evil.example");
    expect(read.status).toBe(200);
  });
});

describe("projects", () => {
  it("creates a project with the creator as owner, renames, archives and restores it, each in the audit log", async () => {
    const { agent } = await signUpFresh(t.app, "projects");
    const p = await newProject(agent, "Kelp circadian models");
    const detail = await agent.get(`/api/projects/${p.id}`);
    expect(detail.body.data).toMatchObject({ name: "Kelp circadian models", role: "owner", archived: false });
    expect(detail.body.data.capabilities).toContain("project:manage");
    expect((await agent.patch(`/api/projects/${p.id}`).send({ name: "Kelp clock models" })).body.data.name).toBe(
      "Kelp clock models",
    );
    expect((await agent.patch(`/api/projects/${p.id}`).send({ archived: true })).body.data.archived).toBe(true);
    expect((await agent.patch(`/api/projects/${p.id}`).send({ archived: false })).body.data.archived).toBe(false);
    const audit = await agent.get(`/api/projects/${p.id}/audit`);
    expect(audit.body.data.map((e: { action: string }) => e.action)).toEqual([
      "project.restore",
      "project.archive",
      "project.rename",
      "project.create",
    ]);
    expect(audit.body.data[2]).toMatchObject({
      actorName: "Fixture projects",
      target: "Kelp clock models",
      details: { from: "Kelp circadian models" },
    });
  });

  it("refuses an over-long or blank name with 400 and leaves the project unchanged", async () => {
    const { agent } = await signUpFresh(t.app, "badname");
    const p = await newProject(agent);
    for (const name of ["x".repeat(121), "   "]) {
      const res = await agent.patch(`/api/projects/${p.id}`).send({ name });
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe("INVALID_INPUT");
    }
    expect((await agent.get(`/api/projects/${p.id}`)).body.data.name).toBe(p.name);
    expect((await agent.post("/api/projects").send({ name: "y".repeat(121) })).status).toBe(400);
  });

  it("stores a project name full of SQL metacharacters verbatim and finds it again", async () => {
    const { agent } = await signUpFresh(t.app, "sqlname");
    const name = `'; DROP TABLE projects; -- "x" \\ %_ ${randomUUID().slice(0, 4)}`;
    const p = await newProject(agent, name);
    expect(p.name).toBe(name);
    expect((await agent.get("/api/projects")).body.data.map((x: { name: string }) => x.name)).toEqual([name]);
  });

  it("deletes only when the typed name matches exactly", async () => {
    const { agent } = await signUpFresh(t.app, "delete");
    const p = await newProject(agent, "Doomed project");
    const mismatch = await agent.delete(`/api/projects/${p.id}`).send({ confirmName: "doomed project" });
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.error.code).toBe("CONFIRMATION_MISMATCH");
    expect((await agent.delete(`/api/projects/${p.id}`).send({})).status).toBe(400);
    expect((await agent.get(`/api/projects/${p.id}`)).status).toBe(200);
    expect((await agent.delete(`/api/projects/${p.id}`).send({ confirmName: "Doomed project" })).status).toBe(204);
    expect((await agent.get(`/api/projects/${p.id}`)).status).toBe(404);
  });

  it("answers 404 for a malformed project id and for a project the caller is not in", async () => {
    const { agent } = await signUpFresh(t.app, "outsider");
    expect((await agent.get("/api/projects/not-a-uuid")).status).toBe(404);
    expect((await agent.get("/api/projects/00000000-0000-4000-8000-000000000001")).status).toBe(404);
    expect((await agent.get(`/api/projects/${randomUUID()}`)).status).toBe(404);
  });

  it("lists only the caller's projects, but every project for a site admin", async () => {
    const { agent } = await signUpFresh(t.app, "lister");
    const mine = await newProject(agent);
    const listed = (await agent.get("/api/projects")).body.data.map((p: { id: string }) => p.id);
    expect(listed).toEqual([mine.id]);
    const admin = await signInAs(t.app, "admin@demo.emulant.test");
    const all = (await admin.get("/api/projects")).body.data.map((p: { id: string }) => p.id);
    expect(all).toContain(mine.id);
    expect(all).toContain("00000000-0000-4000-8000-000000000001");
  });
});

describe("members and the last owner", () => {
  it("refuses to demote or remove the last owner with 409 LAST_OWNER, and allows it once there is another owner", async () => {
    const owner = await signUpFresh(t.app, "lastowner");
    const p = await newProject(owner.agent);
    for (const res of [
      await owner.agent.patch(`/api/projects/${p.id}/members/${owner.id}`).send({ role: "viewer" }),
      await owner.agent.delete(`/api/projects/${p.id}/members/${owner.id}`),
    ]) {
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe("LAST_OWNER");
    }
    const second = await signUpFresh(t.app, "secondowner");
    const token = await invite(owner.agent, p.id, second.email, "owner");
    expect((await second.agent.post(`/api/invitations/${token}/accept`).send({})).status).toBe(200);
    const demoted = await owner.agent.patch(`/api/projects/${p.id}/members/${owner.id}`).send({ role: "viewer" });
    expect(demoted.status).toBe(200);
    expect(demoted.body.data.role).toBe("viewer");
    // The former owner is now a viewer and may no longer manage the project.
    expect((await owner.agent.patch(`/api/projects/${p.id}`).send({ name: "Mine again" })).status).toBe(403);
  });

  it("lets exactly one of two owners demoting each other at the same moment succeed", async () => {
    const a = await signUpFresh(t.app, "race-a");
    const b = await signUpFresh(t.app, "race-b");
    const p = await newProject(a.agent);
    const token = await invite(a.agent, p.id, b.email, "owner");
    expect((await b.agent.post(`/api/invitations/${token}/accept`).send({})).status).toBe(200);
    const results = await Promise.all([
      a.agent.patch(`/api/projects/${p.id}/members/${b.id}`).send({ role: "viewer" }),
      b.agent.patch(`/api/projects/${p.id}/members/${a.id}`).send({ role: "viewer" }),
    ]);
    // The loser is refused either by the last-owner check (both passed the role check before either change landed,
    // 409) or by the role check itself (the winner's change landed first, 403); which one depends on timing.
    const [won, lost] = results.map((r) => r.status).sort();
    expect(won).toBe(200);
    expect([403, 409]).toContain(lost);
    const owners = await t.db("memberships").where({ project_id: p.id, role: "owner" });
    expect(owners).toHaveLength(1);
  });

  it("refuses an unknown role and a member id that is not a uuid, changing nothing", async () => {
    const owner = await signUpFresh(t.app, "badrole");
    const p = await newProject(owner.agent);
    expect(
      (await owner.agent.patch(`/api/projects/${p.id}/members/${owner.id}`).send({ role: "emperor" })).status,
    ).toBe(400);
    expect((await owner.agent.patch(`/api/projects/${p.id}/members/1;drop`).send({ role: "viewer" })).status).toBe(400);
    const members = (await owner.agent.get(`/api/projects/${p.id}/members`)).body.data;
    expect(members).toEqual([expect.objectContaining({ userId: owner.id, role: "owner" })]);
  });
});

describe("invitations", () => {
  it("mails a single-use link; accepting creates the account with the invited role and signs the person in", async () => {
    const owner = await signUpFresh(t.app, "inviter");
    const p = await newProject(owner.agent, "Invitation lab");
    const email = uniqueEmail("invitee");
    const token = await invite(owner.agent, p.id, email, "viewer");
    const mail = await t.db("mail_messages").whereRaw("? = any(mail_to)", [email]).first();
    expect(mail.subject).toBe('Fixture inviter invited you to "Invitation lab" on Emulant');
    expect(await t.db("invitations").where({ token_hash: token }).first()).toBeUndefined();

    const preview = await request(t.app).get(`/api/invitations/${token}`);
    expect(preview.body.data).toMatchObject({
      projectName: "Invitation lab",
      email,
      role: "viewer",
      accountExists: false,
      invitedByName: "Fixture inviter",
    });

    const invitee = request.agent(t.app);
    const tooShort = await invitee
      .post(`/api/invitations/${token}/accept`)
      .send({ displayName: "Ivo", password: "short" });
    expect(tooShort.status).toBe(400);
    const missing = await invitee.post(`/api/invitations/${token}/accept`).send({});
    expect(missing.status).toBe(400);
    expect(await t.db("users").where({ email }).first()).toBeUndefined();

    const accepted = await invitee
      .post(`/api/invitations/${token}/accept`)
      .send({ displayName: "Ivo Marsh", password: "ivo-password-1" });
    expect(accepted.status).toBe(200);
    expect(accepted.body.data).toEqual({ projectId: p.id, role: "viewer" });
    const project = await invitee.get(`/api/projects/${p.id}`);
    expect(project.body.data).toMatchObject({ role: "viewer", capabilities: ["project:read"] });
    expect((await invitee.patch(`/api/projects/${p.id}`).send({ name: "Hijacked" })).status).toBe(403);

    const reused = await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .send({ displayName: "Someone", password: "some-password-1" });
    expect(reused.status).toBe(410);
    expect(reused.body.error.code).toBe("INVITATION_USED");
    const audit = (await owner.agent.get(`/api/projects/${p.id}/audit`)).body.data.map(
      (e: { action: string }) => e.action,
    );
    expect(audit.slice(0, 2)).toEqual(["invitation.accept", "invitation.create"]);
  });

  it("shows invitee addresses in the audit log to owners only; a viewer sees them masked", async () => {
    const owner = await signUpFresh(t.app, "audit-owner");
    const viewer = await signUpFresh(t.app, "audit-viewer");
    const p = await newProject(owner.agent);
    const token = await invite(owner.agent, p.id, viewer.email, "viewer");
    expect((await viewer.agent.post(`/api/invitations/${token}/accept`).send({})).status).toBe(200);
    const outsider = uniqueEmail("outsider");
    await invite(owner.agent, p.id, outsider, "modeler");
    const targetOf = async (agent: Agent) =>
      ((await agent.get(`/api/projects/${p.id}/audit`)).body.data as { action: string; target: string }[])
        .filter((e) => e.action === "invitation.create")
        .map((e) => e.target);
    expect(await targetOf(owner.agent)).toEqual([outsider, viewer.email]);
    const masked = await targetOf(viewer.agent);
    expect(masked).toEqual([`o…@fixture.emulant.test`, `a…@fixture.emulant.test`]);
    expect(JSON.stringify((await viewer.agent.get(`/api/projects/${p.id}/audit`)).body)).not.toContain(outsider);
  });

  it("refuses an expired token with 410 INVITATION_EXPIRED and adds nobody", async () => {
    const owner = await signUpFresh(t.app, "expiry");
    const p = await newProject(owner.agent);
    const email = uniqueEmail("late");
    const token = await invite(owner.agent, p.id, email, "modeler");
    await t
      .db("invitations")
      .where({ project_id: p.id, email })
      .update({ expires_at: t.db.raw("now() - interval '1 minute'") });
    const res = await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .send({ displayName: "Late", password: "late-password-1" });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe("INVITATION_EXPIRED");
    expect(await t.db("users").where({ email }).first()).toBeUndefined();
  });

  it("replaces an earlier invitation to the same address, and refuses unknown or malformed tokens", async () => {
    const owner = await signUpFresh(t.app, "reinvite");
    const p = await newProject(owner.agent);
    const email = uniqueEmail("twice");
    const first = await invite(owner.agent, p.id, email, "viewer");
    const second = await invite(owner.agent, p.id, email, "reviewer");
    expect((await request(t.app).get(`/api/invitations/${first}`)).body.error.code).toBe("INVITATION_REVOKED");
    expect((await request(t.app).get(`/api/invitations/${second}`)).body.data.role).toBe("reviewer");
    expect((await request(t.app).get(`/api/invitations/${"A".repeat(43)}`)).status).toBe(404);
    const malformed = await request(t.app).get(`/api/invitations/${encodeURIComponent("' or 1=1 --")}`);
    expect(malformed.status).toBe(400);
    const pending = (await owner.agent.get(`/api/projects/${p.id}/invitations`)).body.data;
    expect(pending).toHaveLength(1);
    expect(pending[0]).toMatchObject({ email, role: "reviewer" });
  });

  it("asks an existing account to sign in first, and refuses another signed-in account", async () => {
    const owner = await signUpFresh(t.app, "existing-owner");
    const p = await newProject(owner.agent);
    const existing = await signUpFresh(t.app, "existing");
    const stranger = await signUpFresh(t.app, "stranger");
    const token = await invite(owner.agent, p.id, existing.email, "reviewer");
    expect((await request(t.app).get(`/api/invitations/${token}`)).body.data.accountExists).toBe(true);
    const anonymous = await request(t.app).post(`/api/invitations/${token}/accept`).send({});
    expect(anonymous.status).toBe(401);
    expect(anonymous.body.error.code).toBe("SIGN_IN_REQUIRED");
    const wrong = await stranger.agent.post(`/api/invitations/${token}/accept`).send({});
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.code).toBe("WRONG_ACCOUNT");
    const ok = await existing.agent.post(`/api/invitations/${token}/accept`).send({});
    expect(ok.body.data).toEqual({ projectId: p.id, role: "reviewer" });
  });

  it("refuses a malformed address or an existing member, leaving no invitation and sending no mail", async () => {
    const owner = await signUpFresh(t.app, "badinvite");
    const p = await newProject(owner.agent);
    const mailsBefore = Number((await t.db("mail_messages").count<{ count: string }[]>("* as count").first())?.count);
    const malformed = await owner.agent
      .post(`/api/projects/${p.id}/invitations`)
      .send({ email: "nobody@", role: "viewer" });
    expect(malformed.status).toBe(400);
    const member = await owner.agent
      .post(`/api/projects/${p.id}/invitations`)
      .send({ email: owner.email, role: "viewer" });
    expect(member.status).toBe(409);
    expect(member.body.error.code).toBe("ALREADY_MEMBER");
    expect(await t.db("invitations").where({ project_id: p.id })).toEqual([]);
    expect(Number((await t.db("mail_messages").count<{ count: string }[]>("* as count").first())?.count)).toBe(
      mailsBefore,
    );
  });
});

describe("GET /api/mailbox", () => {
  it("shows the fake's catch to a site admin, newest first, filtered by recipient", async () => {
    const owner = await signUpFresh(t.app, "mailbox");
    const p = await newProject(owner.agent);
    const email = uniqueEmail("mailbox-invitee");
    await invite(owner.agent, p.id, email, "viewer");
    const admin = await signInAs(t.app, "admin@demo.emulant.test");
    const res = await admin.get(`/api/mailbox?to=${encodeURIComponent(email)}`);
    expect(res.status).toBe(200);
    expect(res.body.data).toHaveLength(1);
    expect(res.body.data[0].to).toEqual([email]);
    expect(res.body.data[0].textBody).toContain("/invitations/");
    expect((await admin.get("/api/auth/session")).body.data.mailboxAvailable).toBe(true);
  });
});
