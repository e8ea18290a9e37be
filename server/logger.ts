import { pino, type Logger } from "pino";
import type { Config } from "./config";

export function createLogger(config: Pick<Config, "LOG_LEVEL" | "NODE_ENV">): Logger {
  return pino({
    level: config.NODE_ENV === "test" && config.LOG_LEVEL === "info" ? "warn" : config.LOG_LEVEL,
    redact: {
      paths: ["req.headers.cookie", "password", "*.password", "passwordHash", "*.passwordHash", "token", "*.token"],
      censor: "[redacted]",
    },
  });
}
