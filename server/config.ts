// The environment, parsed once with zod so a bad setting stops the process with a message naming the variable.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { z } from "zod";
import { installSecret, weakSecretReason } from "./session-secret";

const defaultSecretFile = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../.data/session-secret");

const Env = z.object({
  NODE_ENV: z.enum(["development", "test", "production"]).default("development"),
  DATABASE_URL: z.string().url({ message: "DATABASE_URL must be a postgres:// URL" }),
  HOST: z.string().default("127.0.0.1"),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  /** Public address used in links sent by e-mail. */
  PUBLIC_URL: z.string().url().optional(),
  /** HMAC secret for session tokens; required in production; elsewhere a random one is kept per install. */
  SESSION_SECRET: z.string().min(32, { message: "must have at least 32 characters" }).optional(),
  /** Where an install without SESSION_SECRET keeps its generated secret. */
  EMULANT_SECRET_FILE: z.string().default(defaultSecretFile),
  /** Express's "trust proxy": unset trusts no proxy, so X-Forwarded-For is ignored unless a proxy is configured. */
  TRUST_PROXY: z.string().optional(),
  /** SMTP server for outgoing mail; when absent, a local fake on 127.0.0.1 stores mail in the database. */
  SMTP_URL: z.string().optional(),
  /** Worker threads in this process's pool; 0 disables the in-process worker. */
  WORKER_THREADS: z.coerce.number().int().min(0).max(64).optional(),
});

export type Config = z.infer<typeof Env> & {
  publicUrl: string;
  sessionSecret: string;
  trustProxy: boolean | number | string;
};

/** "true"/"false", a hop count, or Express's names and addresses ("loopback", "10.0.0.1, 10.0.0.2"). */
function parseTrustProxy(value: string | undefined): boolean | number | string {
  if (value === undefined || value === "" || value === "false") return false;
  if (value === "true") return true;
  if (/^\d+$/.test(value)) return Number(value);
  return value;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = Env.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join("\n")}`);
  }
  const c = parsed.data;
  if (c.NODE_ENV === "production") {
    if (!c.SESSION_SECRET) throw new Error("Invalid configuration:\n  SESSION_SECRET: required in production");
    const weak = weakSecretReason(c.SESSION_SECRET);
    if (weak) throw new Error(`Invalid configuration:\n  SESSION_SECRET: refused in production, ${weak}`);
  }
  return {
    ...c,
    publicUrl: c.PUBLIC_URL ?? `http://${c.HOST}:${c.PORT}`,
    sessionSecret: c.SESSION_SECRET ?? installSecret(c.EMULANT_SECRET_FILE),
    trustProxy: parseTrustProxy(c.TRUST_PROXY),
  };
}
