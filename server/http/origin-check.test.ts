import type { Request } from "express";
import { describe, expect, it } from "vitest";
import { HttpError } from "./errors";
import { originCheck } from "./origin-check";

function run(method: string, headers: Record<string, string>): unknown {
  let passed: unknown = "not called";
  const req = { method, headers, protocol: "http" } as unknown as Request;
  originCheck("https://emulant.example.org")(req, {} as never, (err?: unknown) => {
    passed = err ?? null;
  });
  return passed;
}

describe("originCheck", () => {
  it("originCheck lets through requests without an Origin header (curl, supertest)", () => {
    expect(run("POST", { host: "127.0.0.1:3000" })).toBeNull();
  });

  it("originCheck lets through the request's own origin and the configured public address", () => {
    expect(run("DELETE", { host: "127.0.0.1:3000", origin: "http://127.0.0.1:3000" })).toBeNull();
    expect(run("PATCH", { host: "10.0.0.5", origin: "https://emulant.example.org" })).toBeNull();
  });

  it("originCheck refuses a foreign origin on state-changing methods with 403 BAD_ORIGIN, but not on reads", () => {
    for (const method of ["POST", "PUT", "PATCH", "DELETE"]) {
      const err = run(method, { host: "127.0.0.1:3000", origin: "https://evil.example" });
      expect(err).toBeInstanceOf(HttpError);
      expect(err).toMatchObject({ status: 403, code: "BAD_ORIGIN" });
    }
    expect(run("GET", { host: "127.0.0.1:3000", origin: "https://evil.example" })).toBeNull();
    // A look-alike that only shares a prefix is still foreign.
    expect(run("POST", { host: "127.0.0.1:3000", origin: "http://127.0.0.1:3000.evil.example" })).toMatchObject({
      code: "BAD_ORIGIN",
    });
  });

  it("originCheck lets a foreign origin through when the request carries a bearer token, and refuses it otherwise", () => {
    const foreign = { host: "127.0.0.1:3000", origin: "https://script-host.example" };
    expect(run("POST", { ...foreign, authorization: "Bearer emu_abc" })).toBeNull();
    expect(run("POST", { ...foreign, authorization: "Basic dXNlcjpwdw==" })).toMatchObject({ code: "BAD_ORIGIN" });
  });
});
