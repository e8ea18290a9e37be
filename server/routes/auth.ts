// Sign-up (by mailed link), sign-in, sign-out and the current session.
import type { Request } from "express";
import type { Knex } from "knex";
import type { Logger } from "pino";
import {
  ConfirmSignUpBody,
  Session,
  SessionUser,
  SignInBody,
  SignUpAccepted,
  SignUpBody,
} from "@shared/schemas/accounts";
import { findCredentials, type User } from "../db/repositories/users";
import { HttpError } from "../http/errors";
import { decoyHash, verifyPassword } from "../http/password-hash";
import { signInAddressLimit, signUpLimit, type SignInLimits, type SignUpLimits } from "../http/rate-limits";
import { anyone, routeGroup, type RouteGroup } from "../http/route-group";
import { SignInThrottle, waitMessage } from "../http/sign-in-throttle";
import { endCurrentSession, startSession } from "../http/session-store";
import type { Mailer } from "../mail/mailer";
import { confirmSignUp, requestSignUp } from "../services/accounts/sign-up";

export interface AuthRouterDeps {
  db: Knex;
  log: Logger;
  sessionSecret: string;
  publicUrl?: string;
  mailer: Pick<Mailer, "usesFake" | "send">;
  signInLimits: SignInLimits;
  signUpLimits: SignUpLimits;
}

const sessionUser = (u: User): SessionUser => ({
  id: u.id,
  email: u.email,
  displayName: u.displayName,
  siteRole: u.siteRole,
});

function siteOrigin(req: Request, publicUrl: string | undefined): string {
  return publicUrl ? new URL(publicUrl).origin : `${req.protocol}://${req.get("host")}`;
}

export function authRoutes(deps: AuthRouterDeps): RouteGroup {
  const routes = routeGroup({ mountPath: "/auth", tag: "auth", db: deps.db });
  const throttle = new SignInThrottle(deps.signInLimits.throttle);

  routes.get("/session", {
    summary: "Who is signed in (null when nobody), and whether the local mailbox is open to them",
    access: anyone,
    response: Session,
    handler: ({ user }) => ({
      user: user ?? null,
      mailboxAvailable: deps.mailer.usesFake && user?.siteRole === "admin",
    }),
  });

  routes.post("/sign-up", {
    summary:
      "Ask for an account: a link to finish it is mailed to the address (the answer is the same for any address)",
    access: anyone,
    before: [signUpLimit(deps.signUpLimits)],
    body: SignUpBody,
    response: SignUpAccepted,
    status: 202,
    handler: ({ body, req }) => {
      const origin = siteOrigin(req, deps.publicUrl);
      return requestSignUp(
        {
          db: deps.db,
          log: deps.log,
          mailer: deps.mailer,
          linkFor: (token) => `${origin}/sign-up/finish#${token}`,
          signInUrl: `${origin}/sign-in`,
        },
        body,
      );
    },
  });

  routes.post("/sign-up/confirm", {
    summary: "Finish sign-up with the mailed link's token: creates the account and signs in",
    access: anyone,
    before: [signUpLimit(deps.signUpLimits)],
    body: ConfirmSignUpBody,
    response: SessionUser,
    status: 201,
    async handler({ body, req, res }) {
      const user = await confirmSignUp(deps.db, body.token);
      await startSession(deps.db, deps.sessionSecret, req, res, user);
      return sessionUser(user);
    },
  });

  routes.post("/sign-in", {
    summary: "Sign in with e-mail and password (failures make the next try from that address wait longer)",
    access: anyone,
    before: [signInAddressLimit(deps.signInLimits)],
    body: SignInBody,
    response: SessionUser,
    async handler({ body, req, res }) {
      const address = req.ip ?? "";
      const wait = throttle.waitMs(body.email, address);
      if (wait > 0) {
        res.setHeader("Retry-After", String(Math.ceil(wait / 1000)));
        throw new HttpError(429, "RATE_LIMITED", waitMessage(wait));
      }
      const found = await findCredentials(deps.db, body.email);
      // Unknown addresses are checked against a decoy hash so both failures take the same time.
      const ok = await verifyPassword(body.password, found?.passwordHash ?? (await decoyHash()));
      if (!found || !ok) {
        throttle.recordFailure(body.email, address);
        throw new HttpError(401, "INVALID_CREDENTIALS", "Wrong e-mail address or password");
      }
      throttle.recordSuccess(body.email, address);
      await startSession(deps.db, deps.sessionSecret, req, res, found.user);
      return sessionUser(found.user);
    },
  });

  routes.post("/sign-out", {
    summary: "Sign out: ends this session on the server (every copy of its token) and clears the cookie",
    access: anyone,
    status: 204,
    async handler({ req, res }) {
      await endCurrentSession(deps.db, deps.sessionSecret, req, res);
    },
  });

  return routes;
}
