// The one error shape every API route answers with, and the stable codes it carries. The server may only send a
// code listed here (HttpError and RunRequestError take an ApiErrorCode), and the client switches on the same list.
import { z } from "zod";

export const API_ERROR_CODES = [
  // Requests the server cannot read or accept as they are.
  "INVALID_INPUT", // a field fails its schema or a check zod cannot express; details list { field, message }
  "INVALID_JSON",
  "PARSE_ERROR", // model text or file with mistakes; details list { line, column, message }
  "UNSUPPORTED_FORMAT",
  "TOO_LARGE",
  "LIMIT_EXCEEDED", // an input over a documented limit (docs/limits.md), refused before any work; details name it
  "WORK_LIMIT", // the work needed more time or memory than one request may use (422)
  "UNKNOWN_NODE",
  "UNKNOWN_KIND",
  "CONFIRMATION_MISMATCH",
  // Who is calling and what they may do.
  "UNAUTHENTICATED",
  "INVALID_CREDENTIALS",
  "WRONG_PASSWORD",
  "SIGN_IN_REQUIRED",
  "WRONG_ACCOUNT",
  "FORBIDDEN",
  "BAD_ORIGIN",
  "TOKEN_INVALID", // an Authorization: Bearer token that is unknown, expired or revoked
  "TOKEN_NOT_ALLOWED", // the token's scope or project list does not cover this route
  "RATE_LIMITED",
  // Things that do not exist, or no longer can be used.
  "NOT_FOUND",
  "INVITATION_INVALID",
  "INVITATION_USED",
  "INVITATION_REVOKED",
  "INVITATION_EXPIRED",
  "SIGN_UP_LINK_INVALID", // unknown, used or expired sign-up link
  "HIERARCHY_NOT_COMPUTED",
  "NO_EMULATION",
  // Requests that conflict with what is stored.
  "CONFLICT",
  "EMAIL_TAKEN",
  "ALREADY_MEMBER",
  "LAST_OWNER",
  "PROJECT_ARCHIVED",
  "ALREADY_SAVED",
  "SOURCE_MISMATCH",
  "TARGET_MISMATCH",
  "INVALID_CERTIFICATE",
  "SELF_REDUCTION", // a reduction of a model onto itself (F = G) proves nothing
  "NEEDS_RUN", // the analysis is too large for a request; details name the run kind to start
  "QUEUE_FULL",
  "RUN_FINISHED",
  "RUN_NOT_RETRYABLE",
  // Our side.
  "MAIL_FAILED",
  "DATABASE_UNAVAILABLE",
  "INTERNAL",
] as const;

export const ApiErrorCode = z.enum(API_ERROR_CODES);
export type ApiErrorCode = z.infer<typeof ApiErrorCode>;

export const ApiErrorBody = z.object({
  error: z.object({ code: ApiErrorCode, message: z.string(), details: z.unknown().optional() }),
});
export type ApiErrorBody = z.infer<typeof ApiErrorBody>;
