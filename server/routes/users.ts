// The signed-in person's own profile: name, password and personal access tokens.
import type { Knex } from "knex";
import { ChangePasswordBody, Profile, UpdateProfileBody } from "@shared/schemas/accounts";
import {
  AccessTokenList,
  AccessTokenParams,
  CreatedAccessToken,
  NewAccessTokenBody,
} from "@shared/schemas/access-tokens";
import { listAccessTokens } from "../db/repositories/access-tokens";
import { findUserById, passwordHashOf, updateDisplayName, updatePassword, type User } from "../db/repositories/users";
import { HttpError } from "../http/errors";
import { hashPassword, verifyPassword } from "../http/password-hash";
import { routeGroup, signedIn, type RouteGroup } from "../http/route-group";
import { endSessionsOf } from "../db/repositories/sessions";
import { startSession } from "../http/session-store";
import { createAccessToken, revokeToken } from "../services/access-tokens/access-tokens";

function profile(u: User): Profile {
  return { id: u.id, email: u.email, displayName: u.displayName, siteRole: u.siteRole, createdAt: u.createdAt };
}

export function usersRoutes(deps: { db: Knex; sessionSecret: string }): RouteGroup {
  const routes = routeGroup({ mountPath: "/users", tag: "users", db: deps.db });

  routes.get("/me", {
    summary: "The caller's profile",
    access: signedIn,
    response: Profile,
    async handler({ user: me }) {
      const user = await findUserById(deps.db, me.id);
      if (!user) throw new HttpError(401, "UNAUTHENTICATED", "Sign in to continue");
      return profile(user);
    },
  });

  routes.patch("/me", {
    summary: "Change the caller's display name",
    access: signedIn,
    body: UpdateProfileBody,
    response: Profile,
    handler: async ({ body, user }) => profile(await updateDisplayName(deps.db, user.id, body.displayName)),
  });

  routes.post("/me/password", {
    summary: "Change the caller's password; other sessions end",
    access: signedIn,
    tokens: false,
    body: ChangePasswordBody,
    response: Profile,
    async handler({ body, user: me, req, res }) {
      const stored = await passwordHashOf(deps.db, me.id);
      if (!stored || !(await verifyPassword(body.currentPassword, stored))) {
        throw new HttpError(400, "WRONG_PASSWORD", "The current password is not right");
      }
      const user = await updatePassword(deps.db, me.id, await hashPassword(body.newPassword));
      // Every session ends (the version bump also voids their tokens); this browser continues in a new one.
      await endSessionsOf(deps.db, user.id);
      await startSession(deps.db, deps.sessionSecret, req, res, user);
      return profile(user);
    },
  });

  // Tokens are managed from a browser session only: a token that could mint tokens could outlive its own expiry.
  routes.get("/me/tokens", {
    summary: "The caller's personal access tokens, with when each was last used (never the secrets)",
    access: signedIn,
    tokens: false,
    response: AccessTokenList,
    handler: ({ user }) => listAccessTokens(deps.db, user.id),
  });

  routes.post("/me/tokens", {
    summary: "Create a personal access token; the answer carries its secret, shown this once",
    access: signedIn,
    tokens: false,
    body: NewAccessTokenBody,
    response: CreatedAccessToken,
    status: 201,
    handler: ({ body, user }) => createAccessToken(deps.db, user.id, body),
  });

  routes.delete("/me/tokens/:tokenId", {
    summary: "Revoke one of the caller's personal access tokens",
    access: signedIn,
    tokens: false,
    params: AccessTokenParams,
    status: 204,
    async handler({ params, user }) {
      if (!(await revokeToken(deps.db, user.id, params.tokenId)))
        throw new HttpError(404, "NOT_FOUND", "You have no live token with this id");
    },
  });

  return routes;
}
