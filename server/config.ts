// The environment, parsed once with zod so a bad setting stops the process with a message naming the variable.
import { z } from "zod";

const Env = z.object({
  NODE_ENV: z.enum(["development", "test", "production"]).default("development"),
  DATABASE_URL: z.string().url({ message: "DATABASE_URL must be a postgres:// URL" }),
  HOST: z.string().default("127.0.0.1"),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  /** Public address used in links sent by e-mail. */
  PUBLIC_URL: z.string().url().optional(),
  /** HMAC secret for session tokens; a development default is derived when absent, never in production. */
  SESSION_SECRET: z.string().min(32).optional(),
  /** SMTP server for outgoing mail; when absent, a local fake on 127.0.0.1 stores mail in the database. */
  SMTP_URL: z.string().optional(),
  /** Worker threads in this process's pool; 0 disables the in-process worker. */
  WORKER_THREADS: z.coerce.number().int().min(0).max(64).optional(),
});

export type Config = z.infer<typeof Env> & { publicUrl: string; sessionSecret: string };

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = Env.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join("\n")}`);
  }
  const c = parsed.data;
  if (c.NODE_ENV === "production" && !c.SESSION_SECRET)
    throw new Error("Invalid configuration:\n  SESSION_SECRET: required in production");
  return {
    ...c,
    publicUrl: c.PUBLIC_URL ?? `http://${c.HOST}:${c.PORT}`,
    sessionSecret: c.SESSION_SECRET ?? "emulant-development-secret-not-for-production-use",
  };
}
