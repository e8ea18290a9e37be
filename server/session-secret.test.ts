import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { loadConfig } from "./config";
import { installSecret, weakSecretReason } from "./session-secret";

const tmp = () => fs.mkdtempSync(path.join(os.tmpdir(), "emulant-secret-"));
const base = { DATABASE_URL: "postgres://u:p@127.0.0.1:5432/db" };

describe("installSecret", () => {
  it("creates a random secret with mode 600 on first use and gives the same one back afterwards", () => {
    const file = path.join(tmp(), "nested", "session-secret");
    const first = installSecret(file);
    expect(first.length).toBeGreaterThanOrEqual(60);
    expect(fs.statSync(file).mode & 0o777).toBe(0o600);
    expect(installSecret(file)).toBe(first);
    expect(installSecret(path.join(tmp(), "session-secret"))).not.toBe(first);
  });
});

describe("loadConfig and the session secret", () => {
  it("outside production, an install without SESSION_SECRET signs with its own generated secret", () => {
    const file = path.join(tmp(), "session-secret");
    const config = loadConfig({ ...base, NODE_ENV: "development", EMULANT_SECRET_FILE: file });
    expect(config.sessionSecret).toBe(fs.readFileSync(file, "utf8").trim());
    expect(config.sessionSecret).not.toBe("emulant-development-secret-not-for-production-use");
  });

  it("production refuses a missing, the old published, or a weak secret, naming the variable", () => {
    expect(() => loadConfig({ ...base, NODE_ENV: "production" })).toThrow(/SESSION_SECRET: required in production/);
    expect(() =>
      loadConfig({
        ...base,
        NODE_ENV: "production",
        SESSION_SECRET: "emulant-development-secret-not-for-production-use",
      }),
    ).toThrow(/SESSION_SECRET: refused in production, it is a published example value/);
    expect(() => loadConfig({ ...base, NODE_ENV: "production", SESSION_SECRET: "ab".repeat(20) })).toThrow(
      /fewer than 12 different characters/,
    );
    const strong = "Zq7!pL2#vR9@xT4$wY6%kM8^nB3&cF5*";
    expect(loadConfig({ ...base, NODE_ENV: "production", SESSION_SECRET: strong }).sessionSecret).toBe(strong);
  });

  it("weakSecretReason accepts long varied secrets and refuses short ones", () => {
    expect(weakSecretReason("short")).toMatch(/fewer than 32 characters/);
    expect(weakSecretReason("x".repeat(40))).toMatch(/different characters/);
    expect(weakSecretReason("kP3vN8qR2mX7tL5wZ9yB4cF6hJ1dG0sA")).toBeNull();
  });
});

describe("TRUST_PROXY", () => {
  it("trusts no proxy by default, and takes a hop count or Express's names when configured", () => {
    const file = path.join(tmp(), "session-secret");
    const load = (TRUST_PROXY?: string) => loadConfig({ ...base, EMULANT_SECRET_FILE: file, TRUST_PROXY }).trustProxy;
    expect(load()).toBe(false);
    expect(load("1")).toBe(1);
    expect(load("loopback")).toBe("loopback");
    expect(load("true")).toBe(true);
  });
});
