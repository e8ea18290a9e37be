import request from "supertest";
import { afterAll, describe, expect, it } from "vitest";
import { buildTestApp } from "../support/test-app";

const t = buildTestApp();
afterAll(() => t.close());

describe("GET /api/health", () => {
  it("reports the database as up after a real round trip", async () => {
    const res = await request(t.app).get("/api/health");
    expect(res.status).toBe(200);
    expect(res.body.data.status).toBe("ok");
    expect(res.body.data.database.status).toBe("up");
  });

  it("sets helmet's security headers", async () => {
    const res = await request(t.app).get("/api/health");
    expect(res.headers["x-content-type-options"]).toBe("nosniff");
    expect(res.headers["content-security-policy"]).toContain("default-src 'self'");
  });
});

describe("API error shape", () => {
  it("answers an unknown API route with a JSON 404 in the one error shape", async () => {
    const res = await request(t.app).get("/api/no-such-thing");
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { code: "NOT_FOUND", message: "No route for GET /no-such-thing" } });
  });

  it("answers malformed JSON with 400 INVALID_JSON instead of crashing", async () => {
    const res = await request(t.app).post("/api/health").set("Content-Type", "application/json").send("{not json");
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("INVALID_JSON");
  });
});
