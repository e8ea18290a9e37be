// Sign-up, sign-in, sign-out and the current session.
import { Router } from "express";
import type { Knex } from "knex";
import { SignInBody, SignUpBody } from "@shared/schemas/accounts";
import { findCredentials, findUserByEmail, insertUser } from "../db/repositories/users";
import { HttpError } from "../http/errors";
import { decoyHash, hashPassword, verifyPassword } from "../http/password-hash";
import { signInRateLimits, type SignInLimits } from "../http/rate-limits";
import { clearSessionCookie, setSessionCookie, signSession } from "../http/session";
import { validate } from "../http/validate";
import type { Mailer } from "../mail/mailer";

export interface AuthRouterDeps {
  db: Knex;
  sessionSecret: string;
  mailer: Pick<Mailer, "usesFake">;
  signInLimits: SignInLimits;
}

export function authRouter(deps: AuthRouterDeps): Router {
  const router = Router();

  router.get("/session", (req, res) => {
    const user = req.user ?? null;
    res.json({ data: { user, mailboxAvailable: deps.mailer.usesFake && user?.siteRole === "admin" } });
  });

  router.post("/sign-up", validate({ body: SignUpBody }), async (req, res) => {
    const body = req.body as SignUpBody;
    if (await findUserByEmail(deps.db, body.email)) {
      throw new HttpError(409, "EMAIL_TAKEN", "An account with this e-mail address already exists; sign in instead");
    }
    const user = await insertUser(deps.db, {
      email: body.email,
      displayName: body.displayName,
      passwordHash: await hashPassword(body.password),
    });
    setSessionCookie(req, res, await signSession(deps.sessionSecret, user.id, user.sessionVersion));
    res
      .status(201)
      .json({ data: { id: user.id, email: user.email, displayName: user.displayName, siteRole: user.siteRole } });
  });

  router.post("/sign-in", ...signInRateLimits(deps.signInLimits), validate({ body: SignInBody }), async (req, res) => {
    const body = req.body as SignInBody;
    const found = await findCredentials(deps.db, body.email);
    // Unknown addresses are checked against a decoy hash so both failures take the same time.
    const ok = await verifyPassword(body.password, found?.passwordHash ?? (await decoyHash()));
    if (!found || !ok) throw new HttpError(401, "INVALID_CREDENTIALS", "Wrong e-mail address or password");
    const { user } = found;
    setSessionCookie(req, res, await signSession(deps.sessionSecret, user.id, user.sessionVersion));
    res.json({ data: { id: user.id, email: user.email, displayName: user.displayName, siteRole: user.siteRole } });
  });

  router.post("/sign-out", (req, res) => {
    clearSessionCookie(req, res);
    res.status(204).end();
  });

  return router;
}
