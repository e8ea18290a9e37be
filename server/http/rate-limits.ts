// Sign-in throttling, per account and per client address. Only failed attempts count, so people who type their
// password right are never slowed down, while guessing one account's password, or many accounts' from one
// address, stops after a few tries.
import type { RequestHandler } from "express";
import { rateLimit } from "express-rate-limit";
import { HttpError } from "./errors";

export interface SignInLimits {
  windowMs: number;
  /** Failed attempts allowed per e-mail address in the window. */
  perAccount: number;
  /** Failed attempts allowed per client address in the window. */
  perAddress: number;
}

export const defaultSignInLimits: SignInLimits = { windowMs: 15 * 60 * 1000, perAccount: 5, perAddress: 30 };

function tooMany(windowMs: number): RequestHandler {
  const minutes = Math.max(1, Math.round(windowMs / 60_000));
  return (_req, _res, next) =>
    next(
      new HttpError(
        429,
        "RATE_LIMITED",
        `Too many failed sign-in attempts. Wait ${minutes} minute${minutes === 1 ? "" : "s"} and try again.`,
      ),
    );
}

export function signInRateLimits(limits: SignInLimits): RequestHandler[] {
  const common = {
    windowMs: limits.windowMs,
    skipSuccessfulRequests: true,
    standardHeaders: "draft-8" as const,
    legacyHeaders: false,
    handler: tooMany(limits.windowMs),
  };
  const perAddress = rateLimit({ ...common, limit: limits.perAddress, identifier: "sign-in-address" });
  const perAccount = rateLimit({
    ...common,
    limit: limits.perAccount,
    identifier: "sign-in-account",
    keyGenerator: (req) => {
      // Runs before validation, on the raw body.
      const body: unknown = req.body;
      const email = typeof body === "object" && body !== null && "email" in body ? body.email : undefined;
      return `account:${typeof email === "string" ? email.trim().toLowerCase().slice(0, 254) : ""}`;
    },
  });
  return [perAddress, perAccount];
}
