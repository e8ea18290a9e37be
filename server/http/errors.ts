// One error shape for the whole API: { error: { code, message, details? } }. Everything a handler throws ends here:
// HttpError as it is, a refused run request (RunRequestError) and PostgreSQL errors translated, the rest a logged 500.
import type { ErrorRequestHandler, RequestHandler } from "express";
import type { Logger } from "pino";
import { showInput } from "@shared/engine/rules";
import type { ApiErrorBody, ApiErrorCode } from "@shared/schemas/api-error";
import { translateDatabaseError } from "../db/database-errors";
import { RunRequestError } from "../jobs/run-errors";

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: ApiErrorCode,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = "HttpError";
  }
}

export const notFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, "NOT_FOUND", `No route for ${req.method} ${req.path}`));
};

interface BodyParserError {
  type?: string;
  status?: number;
  expose?: boolean;
}

/** The HTTP answer for a known kind of failure, or null for one that is our fault. */
function knownError(err: unknown): HttpError | null {
  if (err instanceof HttpError) return err;
  if (err instanceof RunRequestError) return new HttpError(err.status, err.code, err.message);
  const bp = err as BodyParserError | undefined;
  if (bp?.type === "entity.parse.failed")
    return new HttpError(400, "INVALID_JSON", "The request body is not valid JSON");
  if (bp?.type === "entity.too.large") return new HttpError(413, "TOO_LARGE", "The request body is too large");
  return translateDatabaseError(err);
}

const MESSAGE_MAX = 2000;

/** Details are lists of { field | line, column, message }; their messages are escaped like the main one. */
function escapeDetailMessages(details: unknown): unknown {
  if (!Array.isArray(details)) return details;
  return details.map((d: unknown) =>
    typeof d === "object" && d !== null && typeof (d as { message?: unknown }).message === "string"
      ? { ...d, message: showInput((d as { message: string }).message, MESSAGE_MAX) }
      : d,
  );
}

export function errorHandler(log: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    let httpError = knownError(err);
    if (!httpError) {
      log.error({ err, requestId: req.id }, "unhandled error");
      httpError = new HttpError(500, "INTERNAL", `Something went wrong on our side (request ${req.id ?? "unknown"})`);
    }
    // Messages may quote what the caller sent; whatever a handler forgot to escape is escaped here, once for all.
    const body: ApiErrorBody["error"] = { code: httpError.code, message: showInput(httpError.message, MESSAGE_MAX) };
    if (httpError.details !== undefined) body.details = escapeDetailMessages(httpError.details);
    res.status(httpError.status).json({ error: body });
  };
}
