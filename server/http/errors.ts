// One error shape for the whole API: { error: { code, message, details? } }.
import type { ErrorRequestHandler, RequestHandler } from "express";
import type { Logger } from "pino";
import { translateDatabaseError } from "../db/database-errors";

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
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

export function errorHandler(log: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    let httpError: HttpError | null = err instanceof HttpError ? err : translateDatabaseError(err);
    const bp = err as BodyParserError;
    if (!httpError && bp?.type === "entity.parse.failed")
      httpError = new HttpError(400, "INVALID_JSON", "The request body is not valid JSON");
    if (!httpError && bp?.type === "entity.too.large")
      httpError = new HttpError(413, "TOO_LARGE", "The request body is too large");
    if (!httpError) {
      log.error({ err, requestId: req.id }, "unhandled error");
      httpError = new HttpError(500, "INTERNAL", `Something went wrong on our side (request ${req.id ?? "unknown"})`);
    }
    const body: { code: string; message: string; details?: unknown } = {
      code: httpError.code,
      message: httpError.message,
    };
    if (httpError.details !== undefined) body.details = httpError.details;
    res.status(httpError.status).json({ error: body });
  };
}
