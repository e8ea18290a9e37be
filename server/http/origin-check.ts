// Cross-site request forgery guard: a state-changing request that names an Origin must come from our own site.
// Requests without an Origin header (curl, supertest, server-to-server) are allowed: browsers always send one on
// cross-site POST/PUT/PATCH/DELETE, and the SameSite=Lax cookie already stays off cross-site subrequests.
// Requests with Authorization: Bearer are judged by their token alone (authenticate ignores their cookie), and a
// browser cannot add that header to a cross-site request without a CORS preflight we never grant: they skip it.
import type { RequestHandler } from "express";
import { HttpError } from "./errors";

const safeMethods = new Set(["GET", "HEAD", "OPTIONS"]);

export function originCheck(publicUrl: string): RequestHandler {
  const publicOrigin = new URL(publicUrl).origin;
  return (req, _res, next) => {
    if (safeMethods.has(req.method)) return next();
    if (/^Bearer /i.test(req.headers.authorization ?? "")) return next();
    const origin = req.headers.origin;
    if (origin === undefined) return next();
    // The request's own host covers the Vite dev proxy and any address the server is reached by.
    const ownOrigin = `${req.protocol}://${req.headers.host ?? ""}`;
    if (origin === ownOrigin || origin === publicOrigin) return next();
    next(new HttpError(403, "BAD_ORIGIN", "This request came from another site and was refused"));
  };
}
