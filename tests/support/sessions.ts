// Signed-in supertest agents for API tests: the agent keeps the session cookie between requests.
import { randomUUID } from "node:crypto";
import request from "supertest";
import type { Express } from "express";
import type { Knex } from "knex";
import { createSession } from "../../server/db/repositories/sessions";
import { SESSION_COOKIE, SESSION_TTL_SECONDS, signSession } from "../../server/http/session";

export const DEMO_PASSWORD = "demo-password";

export type Agent = ReturnType<typeof request.agent>;

/** Signs in with the demo password (or the one given) and returns an agent that carries the session cookie. */
export async function signInAs(app: Express, email: string, password = DEMO_PASSWORD): Promise<Agent> {
  const agent = request.agent(app);
  const res = await agent.post("/api/auth/sign-in").send({ email, password });
  if (res.status !== 200) throw new Error(`signInAs(${email}) failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

// The site admin reads the local mail fake's catch, where sign-up links arrive; one agent per app.
const mailReaders = new WeakMap<Express, Promise<Agent>>();

/** The token of the newest sign-up link mailed to the address, read through the admins' mailbox route. */
export async function signUpLinkToken(app: Express, email: string): Promise<string> {
  if (!mailReaders.has(app)) mailReaders.set(app, signInAs(app, "admin@demo.emulant.test"));
  const admin = await mailReaders.get(app)!;
  const res = await admin.get("/api/mailbox").query({ to: email });
  const mail = (res.body.data as { subject: string; textBody: string }[]).find((m) =>
    /Finish creating/.test(m.subject),
  );
  const token = mail && /\/sign-up\/finish#([A-Za-z0-9_-]+)/.exec(mail.textBody)?.[1];
  if (!token) throw new Error(`no sign-up link was mailed to ${email}`);
  return token;
}

/** Creates a fresh account (unique address) and returns its agent and id; for fixtures independent of the seed. */
export async function signUpFresh(
  app: Express,
  label: string,
  password = DEMO_PASSWORD,
): Promise<{ agent: Agent; id: string; email: string }> {
  const email = `${label}-${randomUUID().slice(0, 8)}@fixture.emulant.test`;
  const agent = request.agent(app);
  const asked = await agent.post("/api/auth/sign-up").send({ email, displayName: `Fixture ${label}`, password });
  if (asked.status !== 202)
    throw new Error(`signUpFresh(${label}) failed: ${asked.status} ${JSON.stringify(asked.body)}`);
  const res = await agent.post("/api/auth/sign-up/confirm").send({ token: await signUpLinkToken(app, email) });
  if (res.status !== 201) throw new Error(`signUpFresh(${label}) failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { agent, id: res.body.data.id as string, email };
}

/**
 * A session cookie minted directly, with its session row, for tests about authorisation or token age rather than
 * sign-in; `issuedAt` (seconds) lets a test make an old token.
 */
export async function sessionCookieFor(
  db: Knex,
  secret: string,
  userId: string,
  opts: { sessionVersion?: number; issuedAt?: number } = {},
): Promise<string> {
  const issuedAt = opts.issuedAt ?? Math.floor(Date.now() / 1000);
  const sessionId = await createSession(db, userId, new Date((issuedAt + SESSION_TTL_SECONDS) * 1000));
  const token = await signSession(secret, { userId, sessionVersion: opts.sessionVersion ?? 1, sessionId }, issuedAt);
  return `${SESSION_COOKIE}=${token}`;
}
