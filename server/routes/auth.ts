// Sign-up, sign-in, sign-out and the current session.
import type { Knex } from "knex";
import { Session, SessionUser, SignInBody, SignUpBody } from "@shared/schemas/accounts";
import { findCredentials, findUserByEmail, insertUser, type User } from "../db/repositories/users";
import { HttpError } from "../http/errors";
import { decoyHash, hashPassword, verifyPassword } from "../http/password-hash";
import { signInRateLimits, type SignInLimits } from "../http/rate-limits";
import { anyone, routeGroup, type RouteGroup } from "../http/route-group";
import { clearSessionCookie, setSessionCookie, signSession } from "../http/session";
import type { Mailer } from "../mail/mailer";

export interface AuthRouterDeps {
  db: Knex;
  sessionSecret: string;
  mailer: Pick<Mailer, "usesFake">;
  signInLimits: SignInLimits;
}

const sessionUser = (u: User): SessionUser => ({
  id: u.id,
  email: u.email,
  displayName: u.displayName,
  siteRole: u.siteRole,
});

export function authRoutes(deps: AuthRouterDeps): RouteGroup {
  const routes = routeGroup({ mountPath: "/auth", tag: "auth", db: deps.db });

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
    summary: "Create an account and sign in",
    access: anyone,
    body: SignUpBody,
    response: SessionUser,
    status: 201,
    async handler({ body, req, res }) {
      if (await findUserByEmail(deps.db, body.email)) {
        throw new HttpError(409, "EMAIL_TAKEN", "An account with this e-mail address already exists; sign in instead");
      }
      const user = await insertUser(deps.db, {
        email: body.email,
        displayName: body.displayName,
        passwordHash: await hashPassword(body.password),
      });
      setSessionCookie(req, res, await signSession(deps.sessionSecret, user.id, user.sessionVersion));
      return sessionUser(user);
    },
  });

  routes.post("/sign-in", {
    summary: "Sign in with e-mail and password (failed attempts are throttled per account and per address)",
    access: anyone,
    before: signInRateLimits(deps.signInLimits),
    body: SignInBody,
    response: SessionUser,
    async handler({ body, req, res }) {
      const found = await findCredentials(deps.db, body.email);
      // Unknown addresses are checked against a decoy hash so both failures take the same time.
      const ok = await verifyPassword(body.password, found?.passwordHash ?? (await decoyHash()));
      if (!found || !ok) throw new HttpError(401, "INVALID_CREDENTIALS", "Wrong e-mail address or password");
      const { user } = found;
      setSessionCookie(req, res, await signSession(deps.sessionSecret, user.id, user.sessionVersion));
      return sessionUser(user);
    },
  });

  routes.post("/sign-out", {
    summary: "Sign out (clears the session cookie)",
    access: anyone,
    status: 204,
    handler({ req, res }) {
      clearSessionCookie(req, res);
    },
  });

  return routes;
}
