// The signed-in person's own profile: name and password.
import { Router } from "express";
import type { Knex } from "knex";
import { ChangePasswordBody, UpdateProfileBody } from "@shared/schemas/accounts";
import { findUserById, passwordHashOf, updateDisplayName, updatePassword, type User } from "../db/repositories/users";
import { currentUser, requireUser } from "../http/auth";
import { HttpError } from "../http/errors";
import { hashPassword, verifyPassword } from "../http/password-hash";
import { setSessionCookie, signSession } from "../http/session";
import { validate } from "../http/validate";

function profile(u: User) {
  return { id: u.id, email: u.email, displayName: u.displayName, siteRole: u.siteRole, createdAt: u.createdAt };
}

export function usersRouter(deps: { db: Knex; sessionSecret: string }): Router {
  const router = Router();

  router.get("/me", requireUser, async (req, res) => {
    const user = await findUserById(deps.db, currentUser(req).id);
    if (!user) throw new HttpError(401, "UNAUTHENTICATED", "Sign in to continue");
    res.json({ data: profile(user) });
  });

  router.patch("/me", requireUser, validate({ body: UpdateProfileBody }), async (req, res) => {
    const body = req.body as UpdateProfileBody;
    res.json({ data: profile(await updateDisplayName(deps.db, currentUser(req).id, body.displayName)) });
  });

  router.post("/me/password", requireUser, validate({ body: ChangePasswordBody }), async (req, res) => {
    const body = req.body as ChangePasswordBody;
    const me = currentUser(req);
    const stored = await passwordHashOf(deps.db, me.id);
    if (!stored || !(await verifyPassword(body.currentPassword, stored))) {
      throw new HttpError(400, "WRONG_PASSWORD", "The current password is not right");
    }
    const user = await updatePassword(deps.db, me.id, await hashPassword(body.newPassword));
    // Other sessions end with the version bump; this one continues with a fresh token.
    setSessionCookie(req, res, await signSession(deps.sessionSecret, user.id, user.sessionVersion));
    res.json({ data: profile(user) });
  });

  return router;
}
