// Where the session-signing secret comes from. A fixed development default would let anyone forge an admin session
// on a default install, so an install without SESSION_SECRET gets a random secret of its own, kept in the
// git-ignored data folder and shared by every process of that install. Production must set SESSION_SECRET, and a
// known or weak value is refused at start-up.
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";

/** Values that were ever public (our old default) or are placeholders people paste from examples. */
const KNOWN_SECRETS = new Set([
  "emulant-development-secret-not-for-production-use",
  "change-me-change-me-change-me-change-me",
  "changemechangemechangemechangeme",
  "secretsecretsecretsecretsecretsecret",
]);

/** Why a production secret is refused, or null when it is acceptable. */
export function weakSecretReason(secret: string): string | null {
  if (secret.length < 32) return "it has fewer than 32 characters";
  if (KNOWN_SECRETS.has(secret.toLowerCase())) return "it is a published example value";
  if (new Set(secret).size < 12) return "it has fewer than 12 different characters";
  return null;
}

/** Reads the install's secret file, creating it (mode 600) on first use; two processes racing agree on one. */
export function installSecret(file: string): string {
  try {
    return readSecret(file);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== "ENOENT") throw err;
  }
  fs.mkdirSync(path.dirname(file), { recursive: true });
  try {
    fs.writeFileSync(file, randomBytes(48).toString("base64url") + "\n", { flag: "wx", mode: 0o600 });
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== "EEXIST") throw err;
  }
  return readSecret(file);
}

function readSecret(file: string): string {
  const secret = fs.readFileSync(file, "utf8").trim();
  if (weakSecretReason(secret)) throw new Error(`The session secret in ${file} is not usable; delete the file`);
  return secret;
}
