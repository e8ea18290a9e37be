// With PostgreSQL unreachable, signed-in pages answer 503 DATABASE_UNAVAILABLE (the caller can retry), not 500.
import request from "supertest";
import { afterAll, describe, expect, it } from "vitest";
import { createApp } from "../../server/app";
import { createDb } from "../../server/db/knex";
import { createLogger } from "../../server/logger";
import { createFakeMailer } from "../../server/mail/mailer";
import { SESSION_COOKIE, signSession } from "../../server/http/session";
import { testConfig } from "../support/test-app";

const config = { ...testConfig(), LOG_LEVEL: "silent" as const };
// Port 9 on loopback (discard) has no listener here: every connection is refused at once.
const db = createDb("postgres://postgres:x@127.0.0.1:9/none", 1);
const log = createLogger(config);
const app = createApp({
  db,
  log,
  config,
  mailer: createFakeMailer(db, log),
  runQueue: { send: async () => "never", stop: async () => {} },
});
afterAll(() => db.destroy());

describe("with the database down", () => {
  it("answers a signed-in project page with 503 DATABASE_UNAVAILABLE and a message saying so", async () => {
    const token = await signSession(config.sessionSecret, {
      userId: "3f1c2a4e-5b6d-4e7f-8a9b-0c1d2e3f4a5b",
      sessionVersion: 1,
      sessionId: "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d",
    });
    const res = await request(app)
      .get("/api/projects/3f1c2a4e-5b6d-4e7f-8a9b-0c1d2e3f4a5b/models")
      .set("Cookie", `${SESSION_COOKIE}=${token}`);
    expect(res.status).toBe(503);
    expect(res.body.error).toEqual({
      code: "DATABASE_UNAVAILABLE",
      message: "The database is not reachable right now; try again shortly",
    });
  });

  it("answers the health check with 503 and says the database is down", async () => {
    const res = await request(app).get("/api/health");
    expect(res.status).toBe(503);
    expect(res.body.data.status).toBe("degraded");
  });
});
