// PostgreSQL errors become HTTP errors here and only here, keyed by SQLSTATE.
import { HttpError } from "../http/errors";

interface PgError {
  code?: string;
  constraint?: string;
  detail?: string;
}

/** Socket errors of the driver, and the pool giving up, mean the same to a caller as a server shutting down. */
const unreachable = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "ENOTFOUND", "EPIPE", "EHOSTUNREACH"]);

function databaseUnreachable(err: unknown): boolean {
  const e = err as { code?: unknown; name?: unknown; message?: unknown } | null;
  if (typeof e !== "object" || e === null) return false;
  if (typeof e.code === "string" && unreachable.has(e.code)) return true;
  if (e.name === "KnexTimeoutError") return true;
  return typeof e.message === "string" && /^Connection terminated/.test(e.message);
}

export function translateDatabaseError(err: unknown): HttpError | null {
  if (databaseUnreachable(err))
    return new HttpError(503, "DATABASE_UNAVAILABLE", "The database is not reachable right now; try again shortly");
  const e = err as PgError;
  if (typeof e?.code !== "string" || e.code.length !== 5) return null;
  switch (e.code) {
    case "23505":
      return new HttpError(
        409,
        "CONFLICT",
        "That already exists",
        e.constraint ? { constraint: e.constraint } : undefined,
      );
    case "23503":
      return new HttpError(
        409,
        "CONFLICT",
        "It is still referenced or refers to something missing",
        e.constraint ? { constraint: e.constraint } : undefined,
      );
    case "23514":
    case "23502":
    case "22001":
    case "22P02":
    case "22003":
      return new HttpError(
        400,
        "INVALID_INPUT",
        "The value does not fit the stored field",
        e.constraint ? { constraint: e.constraint } : undefined,
      );
    // NUL characters (\u0000) cannot be stored in PostgreSQL text or jsonb.
    case "22021":
    case "22P05":
      return new HttpError(
        400,
        "INVALID_INPUT",
        "The text contains a character that cannot be stored (such as \\u0000)",
      );
    case "57P01":
    case "57P03":
    case "08006":
    case "08001":
    case "08003":
      return new HttpError(503, "DATABASE_UNAVAILABLE", "The database is not reachable right now; try again shortly");
    default:
      return null;
  }
}
