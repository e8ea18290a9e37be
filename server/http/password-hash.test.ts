import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { hashPassword, verifyPassword } from "./password-hash";

describe("hashPassword / verifyPassword", () => {
  it("verifyPassword accepts the hashed password and refuses any other", async () => {
    // scrypt costs ~0.1 s per call by design, so few runs.
    await fc.assert(
      fc.asyncProperty(
        fc.string({ minLength: 1, maxLength: 40 }),
        fc.string({ minLength: 1, maxLength: 40 }),
        async (password, other) => {
          fc.pre(password.normalize("NFKC") !== other.normalize("NFKC"));
          const stored = await hashPassword(password);
          expect(await verifyPassword(password, stored)).toBe(true);
          expect(await verifyPassword(other, stored)).toBe(false);
        },
      ),
      { seed: 20261202, numRuns: 6 },
    );
  });

  it("hashPassword salts every hash, names its parameters and never contains the password", async () => {
    const [a, b] = [await hashPassword("correct horse battery"), await hashPassword("correct horse battery")];
    expect(a).not.toBe(b);
    expect(a).toMatch(/^scrypt\$32768\$8\$1\$[A-Za-z0-9+/=]+\$[A-Za-z0-9+/=]+$/);
    expect(a).not.toContain("correct");
  });

  it("verifyPassword refuses a malformed stored value instead of throwing", async () => {
    expect(await verifyPassword("anything", "plaintext-password")).toBe(false);
    expect(await verifyPassword("anything", "scrypt$1$2")).toBe(false);
  });
});
