import { describe, expect, it } from "vitest";
import { bearerToken } from "./auth";

describe("bearerToken", () => {
  it("bearerToken reads the token of an Authorization: Bearer header, in any case of the scheme", () => {
    expect(bearerToken("Bearer emu_abc")).toBe("emu_abc");
    expect(bearerToken("bearer  emu_abc ")).toBe("emu_abc");
  });

  it("bearerToken answers null without a header and an empty string for any other scheme or shape", () => {
    expect(bearerToken(undefined)).toBeNull();
    expect(bearerToken("Basic dXNlcjpwdw==")).toBe("");
    expect(bearerToken("Bearer")).toBe("");
    expect(bearerToken("Bearer two parts")).toBe("");
  });
});
