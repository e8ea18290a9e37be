// One log line per request with a request id that error responses quote, so a user's report finds its log line.
import type { RequestHandler } from "express";
import { randomUUID } from "node:crypto";
import type { Logger } from "pino";

declare module "express-serve-static-core" {
  interface Request {
    id?: string;
  }
}

export function requestLog(log: Logger): RequestHandler {
  return (req, res, next) => {
    req.id = randomUUID();
    res.setHeader("X-Request-Id", req.id);
    const started = process.hrtime.bigint();
    res.on("finish", () => {
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      log.info(
        {
          requestId: req.id,
          method: req.method,
          path: req.originalUrl.split("?")[0],
          status: res.statusCode,
          ms: Math.round(ms),
        },
        "request",
      );
    });
    next();
  };
}
