// Starting, renewing and ending sessions: a row in `sessions` plus the signed cookie that names it.
import type { Request, Response } from "express";
import type { Knex } from "knex";
import { createSession, endSession, extendSession } from "../db/repositories/sessions";
import {
  SESSION_COOKIE,
  SESSION_TTL_SECONDS,
  clearSessionCookie,
  readCookie,
  setSessionCookie,
  signSession,
  verifySession,
} from "./session";

interface SessionOwner {
  id: string;
  sessionVersion: number;
}

const expiry = () => new Date(Date.now() + SESSION_TTL_SECONDS * 1000);

export async function startSession(db: Knex, secret: string, req: Request, res: Response, user: SessionOwner) {
  const sessionId = await createSession(db, user.id, expiry());
  const token = await signSession(secret, { userId: user.id, sessionVersion: user.sessionVersion, sessionId });
  setSessionCookie(req, res, token);
}

/** A fresh token for the same session, which lives another full lifetime from now. */
export async function renewSession(
  db: Knex,
  secret: string,
  req: Request,
  res: Response,
  user: SessionOwner,
  sessionId: string,
) {
  await extendSession(db, sessionId, expiry());
  const token = await signSession(secret, { userId: user.id, sessionVersion: user.sessionVersion, sessionId });
  setSessionCookie(req, res, token);
}

/** Ends the session the request's cookie names, if any, and clears the cookie either way. */
export async function endCurrentSession(db: Knex, secret: string, req: Request, res: Response) {
  const token = readCookie(req, SESSION_COOKIE);
  const claims = token ? await verifySession(secret, token) : null;
  if (claims) await endSession(db, claims.sessionId);
  clearSessionCookie(req, res);
}
