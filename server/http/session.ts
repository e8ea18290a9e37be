// Session tokens: HS256 JWTs (jose) in an httpOnly SameSite=Lax cookie. A token lives 8 hours; once it is older
// than an hour, the next request gets a fresh one, so an active person stays signed in and a stolen old token
// expires soon. The token names a server-side session row (its `jti`), which signing out ends, and carries the
// user's session version: changing the password invalidates older tokens.
import type { Request, Response } from "express";
import { jwtVerify, SignJWT } from "jose";

export const SESSION_COOKIE = "emulant_session";
export const SESSION_TTL_SECONDS = 8 * 60 * 60;
export const ROTATE_AFTER_SECONDS = 60 * 60;

export interface SessionClaims {
  userId: string;
  sessionVersion: number;
  sessionId: string;
  issuedAt: number;
}

const encoder = new TextEncoder();

export async function signSession(
  secret: string,
  claims: Omit<SessionClaims, "issuedAt">,
  nowSeconds = Math.floor(Date.now() / 1000),
): Promise<string> {
  return new SignJWT({ sv: claims.sessionVersion })
    .setProtectedHeader({ alg: "HS256" })
    .setSubject(claims.userId)
    .setJti(claims.sessionId)
    .setIssuedAt(nowSeconds)
    .setExpirationTime(nowSeconds + SESSION_TTL_SECONDS)
    .setIssuer("emulant")
    .sign(encoder.encode(secret));
}

/** Null for any token that is malformed, forged, expired or issued by someone else. */
export async function verifySession(secret: string, token: string): Promise<SessionClaims | null> {
  try {
    const { payload } = await jwtVerify(token, encoder.encode(secret), { algorithms: ["HS256"], issuer: "emulant" });
    const { sub, sv, jti, iat } = payload;
    if (typeof sub !== "string" || typeof sv !== "number" || typeof jti !== "string" || typeof iat !== "number")
      return null;
    return { userId: sub, sessionVersion: sv, sessionId: jti, issuedAt: iat };
  } catch {
    return null;
  }
}

/** Reads one cookie from the Cookie header (no cookie-parser dependency for a single value). */
export function readCookie(req: Request, name: string): string | null {
  const header = req.headers.cookie;
  if (!header) return null;
  for (const part of header.split(";")) {
    const eq = part.indexOf("=");
    if (eq < 0) continue;
    if (part.slice(0, eq).trim() === name) {
      try {
        return decodeURIComponent(part.slice(eq + 1).trim());
      } catch {
        return null;
      }
    }
  }
  return null;
}

function cookieOptions(req: Request) {
  return { httpOnly: true, sameSite: "lax" as const, secure: req.secure, path: "/" };
}

export function setSessionCookie(req: Request, res: Response, token: string): void {
  res.cookie(SESSION_COOKIE, token, { ...cookieOptions(req), maxAge: SESSION_TTL_SECONDS * 1000 });
}

export function clearSessionCookie(req: Request, res: Response): void {
  res.clearCookie(SESSION_COOKIE, cookieOptions(req));
}
