// Signed-in supertest agents for API tests: the agent keeps the session cookie between requests.
import { randomUUID } from "node:crypto";
import request from "supertest";
import type { Express } from "express";

export const DEMO_PASSWORD = "demo-password";

export type Agent = ReturnType<typeof request.agent>;

/** Signs in with the demo password (or the one given) and returns an agent that carries the session cookie. */
export async function signInAs(app: Express, email: string, password = DEMO_PASSWORD): Promise<Agent> {
  const agent = request.agent(app);
  const res = await agent.post("/api/auth/sign-in").send({ email, password });
  if (res.status !== 200) throw new Error(`signInAs(${email}) failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

/** Creates a fresh account (unique address) and returns its agent and id; for fixtures independent of the seed. */
export async function signUpFresh(
  app: Express,
  label: string,
  password = DEMO_PASSWORD,
): Promise<{ agent: Agent; id: string; email: string }> {
  const email = `${label}-${randomUUID().slice(0, 8)}@fixture.emulant.test`;
  const agent = request.agent(app);
  const res = await agent.post("/api/auth/sign-up").send({ email, displayName: `Fixture ${label}`, password });
  if (res.status !== 201) throw new Error(`signUpFresh(${label}) failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { agent, id: res.body.data.id as string, email };
}
