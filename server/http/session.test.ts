import type { Request } from "express";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { readCookie, SESSION_TTL_SECONDS, signSession, verifySession } from "./session";

const secret = "a-test-secret-that-is-at-least-32-characters";
const userId = "3f1c2a4e-5b6d-4e7f-8a9b-0c1d2e3f4a5b";
const sessionId = "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d";
const claims = (sessionVersion: number) => ({ userId, sessionVersion, sessionId });

describe("signSession / verifySession", () => {
  it("verifySession(signSession(...)) gives back the user, session version, session id and issue time", async () => {
    const now = Math.floor(Date.now() / 1000);
    const token = await signSession(secret, claims(7), now);
    expect(await verifySession(secret, token)).toEqual({ userId, sessionVersion: 7, sessionId, issuedAt: now });
  });

  it("verifySession refuses a token past its 8-hour lifetime", async () => {
    const issued = Math.floor(Date.now() / 1000) - SESSION_TTL_SECONDS - 5;
    expect(await verifySession(secret, await signSession(secret, claims(1), issued))).toBeNull();
  });

  it("verifySession refuses a token signed with another secret", async () => {
    expect(await verifySession(secret, await signSession(secret + "x", claims(1)))).toBeNull();
  });

  it("verifySession refuses any single-character change to a valid token", async () => {
    const token = await signSession(secret, claims(1));
    await fc.assert(
      fc.asyncProperty(
        fc.nat({ max: token.length - 1 }),
        fc.constantFrom(..."ABCxyz019-_."),
        async (index, replacement) => {
          fc.pre(token[index] !== replacement);
          const tampered = token.slice(0, index) + replacement + token.slice(index + 1);
          // Base64url's last character can carry unused bits, so a change there may decode to the same bytes.
          const verified = await verifySession(secret, tampered);
          if (verified) expect(index).toBe(token.length - 1);
        },
      ),
      { seed: 20261202, numRuns: 300 },
    );
  });
});

describe("readCookie", () => {
  const req = (cookie?: string) => ({ headers: cookie === undefined ? {} : { cookie } }) as Request;

  it("readCookie finds one cookie among several and decodes it", () => {
    expect(readCookie(req("a=1; emulant_session=x%20y; b=2"), "emulant_session")).toBe("x y");
  });

  it("readCookie answers null when the header or the cookie is missing, or the value is badly encoded", () => {
    expect(readCookie(req(), "emulant_session")).toBeNull();
    expect(readCookie(req("other=1"), "emulant_session")).toBeNull();
    expect(readCookie(req("emulant_session=%E0%A4%A"), "emulant_session")).toBeNull();
  });
});
