// Limits on the account routes. Password guesses: failures per client address across all accounts (a hard limit,
// express-rate-limit) and, per account and address, waits that grow with each failure (sign-in-throttle.ts), so
// nobody can lock an account's owner out by guessing from elsewhere. Sign-up: requests per client address, since
// each one sends an e-mail.
import type { RequestHandler } from "express";
import { rateLimit } from "express-rate-limit";
import { HttpError } from "./errors";
import { defaultSignInThrottle, type SignInThrottleSettings } from "./sign-in-throttle";

export interface SignInLimits {
  windowMs: number;
  /** Failed attempts allowed per client address in the window, whatever the accounts. */
  perAddress: number;
  throttle: SignInThrottleSettings;
}

export interface SignUpLimits {
  windowMs: number;
  /** Sign-up requests allowed per client address in the window. */
  perAddress: number;
}

export const defaultSignInLimits: SignInLimits = {
  windowMs: 15 * 60 * 1000,
  perAddress: 30,
  throttle: defaultSignInThrottle,
};

export const defaultSignUpLimits: SignUpLimits = { windowMs: 60 * 60 * 1000, perAddress: 10 };

function minutes(windowMs: number): string {
  const m = Math.max(1, Math.round(windowMs / 60_000));
  return `${m} minute${m === 1 ? "" : "s"}`;
}

function refuse(message: string): RequestHandler {
  return (_req, _res, next) => next(new HttpError(429, "RATE_LIMITED", message));
}

const common = { standardHeaders: "draft-8" as const, legacyHeaders: false };

export function signInAddressLimit(limits: SignInLimits): RequestHandler {
  return rateLimit({
    ...common,
    windowMs: limits.windowMs,
    limit: limits.perAddress,
    skipSuccessfulRequests: true,
    identifier: "sign-in-address",
    handler: refuse(
      `Too many failed sign-in attempts from your address. Wait ${minutes(limits.windowMs)} and try again.`,
    ),
  });
}

export function signUpLimit(limits: SignUpLimits): RequestHandler {
  return rateLimit({
    ...common,
    windowMs: limits.windowMs,
    limit: limits.perAddress,
    identifier: "sign-up-address",
    handler: refuse(`Too many sign-up requests from your address. Wait ${minutes(limits.windowMs)} and try again.`),
  });
}
