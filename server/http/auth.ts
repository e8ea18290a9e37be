// Who is calling and what may they do. `authenticate` runs on every API request and sets req.user from the
// session cookie, or from a personal access token (Authorization: Bearer), which then also sets req.accessToken;
// routes then ask for the least they need: requireUser, requireSiteAdmin, or projectAccess(db,
// capability), which also hides projects the caller is not in behind a 404 so their existence does not leak.
import type { Request, RequestHandler } from "express";
import type { Knex } from "knex";
import { can, type Capability, type ProjectRole, type SiteRole } from "@shared/types/roles";
import type { TokenScope } from "@shared/schemas/access-tokens";
import { useAccessToken } from "../db/repositories/access-tokens";
import { roleOf } from "../db/repositories/memberships";
import { findProject } from "../db/repositories/projects";
import { findUserById } from "../db/repositories/users";
import { HttpError } from "./errors";
import { sessionIsLive } from "../db/repositories/sessions";
import { ROTATE_AFTER_SECONDS, SESSION_COOKIE, clearSessionCookie, readCookie, verifySession } from "./session";
import { renewSession } from "./session-store";

export interface AuthUser {
  id: string;
  email: string;
  displayName: string;
  siteRole: SiteRole;
}
export interface ProjectContext {
  id: string;
  name: string;
  archived: boolean;
  role: ProjectRole | null;
}

/** The token a request was authenticated with: what it may do on top of its owner's role. */
export interface RequestToken {
  id: string;
  scope: TokenScope;
  /** null: every project the owner is in. */
  projectIds: string[] | null;
}

declare module "express-serve-static-core" {
  interface Request {
    user?: AuthUser;
    project?: ProjectContext;
    accessToken?: RequestToken;
  }
}

/** The token of an Authorization header; null without one, "" for a header that is not `Bearer <token>`. */
export function bearerToken(header: string | undefined): string | null {
  if (header === undefined) return null;
  const match = /^Bearer +(\S+) *$/i.exec(header);
  return match ? match[1]! : "";
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function isUuid(value: unknown): value is string {
  return typeof value === "string" && uuidPattern.test(value);
}

/**
 * Sets req.user when the session cookie holds a valid token for an existing account whose session version still
 * matches and whose session row is live (not signed out, not expired); otherwise the request continues anonymous
 * (and a stale cookie is cleared). Rotates old tokens.
 */
export function authenticate(db: Knex, sessionSecret: string): RequestHandler {
  return async (req, res, next) => {
    const bearer = bearerToken(req.headers.authorization);
    // A request that presents a token is judged by it alone: any cookie it also carries is ignored.
    if (bearer !== null) return next(await tokenCaller(db, req, bearer));
    const token = readCookie(req, SESSION_COOKIE);
    if (!token) return next();
    const claims = await verifySession(sessionSecret, token);
    const valid = claims !== null && isUuid(claims.userId) && isUuid(claims.sessionId);
    const user = valid ? await findUserById(db, claims.userId) : null;
    if (
      !claims ||
      !user ||
      user.sessionVersion !== claims.sessionVersion ||
      !(await sessionIsLive(db, claims.sessionId, user.id))
    ) {
      clearSessionCookie(req, res);
      return next();
    }
    req.user = { id: user.id, email: user.email, displayName: user.displayName, siteRole: user.siteRole };
    const ageSeconds = Math.floor(Date.now() / 1000) - claims.issuedAt;
    if (ageSeconds > ROTATE_AFTER_SECONDS) await renewSession(db, sessionSecret, req, res, user, claims.sessionId);
    next();
  };
}

async function tokenCaller(db: Knex, req: Request, bearer: string): Promise<HttpError | undefined> {
  const invalid = new HttpError(
    401,
    "TOKEN_INVALID",
    "The access token is unknown, expired or revoked; send Authorization: Bearer <token> with a live token",
  );
  if (!bearer) return invalid;
  const token = await useAccessToken(db, bearer);
  const user = token ? await findUserById(db, token.userId) : null;
  if (!token || !user) return invalid;
  // A token acts with member rights only: site-administrator powers stay with the browser session, so a leaked
  // token of an administrator reaches no more than that person's own projects.
  req.user = { id: user.id, email: user.email, displayName: user.displayName, siteRole: "member" };
  req.accessToken = { id: token.id, scope: token.scope, projectIds: token.projectIds };
  return undefined;
}

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(new HttpError(401, "UNAUTHENTICATED", "Sign in to continue"));
  next();
};

export const requireSiteAdmin: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(new HttpError(401, "UNAUTHENTICATED", "Sign in to continue"));
  if (req.accessToken)
    return next(new HttpError(403, "TOKEN_NOT_ALLOWED", "Site-administrator actions do not accept access tokens"));
  if (req.user.siteRole !== "admin")
    return next(new HttpError(403, "FORBIDDEN", "Only site administrators may do this"));
  next();
};

/** Capabilities that change a project's content; an archived project refuses them until it is restored. */
const contentWrites: ReadonlySet<Capability> = new Set(["model:write", "run:start", "review:decide", "comment:write"]);

/**
 * Guards every route under /api/projects/:projectId. 401 when anonymous; 404 when the project does not exist or
 * the caller is neither a member nor a site admin; 403 when the caller's role lacks the capability; 409
 * PROJECT_ARCHIVED for content changes in an archived project. Sets req.project for the handler.
 */
export function projectAccess(db: Knex, capability: Capability): RequestHandler {
  return async (req, _res, next) => {
    const user = req.user;
    if (!user) return next(new HttpError(401, "UNAUTHENTICATED", "Sign in to continue"));
    const projectId = req.params.projectId;
    const notFound = new HttpError(404, "NOT_FOUND", "No such project");
    if (!isUuid(projectId)) return next(notFound);
    const project = await findProject(db, projectId);
    if (!project) return next(notFound);
    const role = await roleOf(db, project.id, user.id);
    if (role === null && user.siteRole !== "admin") return next(notFound);
    const limit = req.accessToken?.projectIds;
    if (limit && !limit.includes(project.id))
      return next(new HttpError(403, "TOKEN_NOT_ALLOWED", "This access token is limited to other projects"));
    if (!can(role, user.siteRole, capability)) {
      return next(new HttpError(403, "FORBIDDEN", `Your role in this project (${role ?? "none"}) does not allow this`));
    }
    if (project.archived && contentWrites.has(capability)) {
      return next(
        new HttpError(409, "PROJECT_ARCHIVED", "This project is archived; restore it before changing its content"),
      );
    }
    req.project = { id: project.id, name: project.name, archived: project.archived, role };
    next();
  };
}
