// verify on files as a user would write them: node names that every JavaScript object inherits, and time scales far
// beyond the documented bound, which must be refused at once rather than simulated.
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it, vi } from "vitest";
import { BUILT_IN_NAMES } from "@shared/engine/certificates/built-in-names.test-support";
import { captureOutput } from "../capture-output.test-support";
import { run as verify } from "./verify";

afterEach(() => vi.restoreAllMocks());

const dir = mkdtempSync(path.join(tmpdir(), "emulant-verify-cli-"));
const file = (name: string, value: unknown) => {
  const p = path.join(dir, name);
  writeFileSync(p, JSON.stringify(value));
  return p;
};

/** The swap a' = b, b' = a emulating a kept bit at t = 2, block {a}, context as given. */
const swapJson = (a: string, b: string, context: Record<string, number>, time = 2) => ({
  format: "emulant-reduction",
  version: 1,
  notion: "block-emulation",
  time,
  source: {
    nodes: [
      { name: a, inputs: [b], table: "01" },
      { name: b, inputs: [a], table: "01" },
    ],
  },
  target: { nodes: [{ name: "g", inputs: ["g"], table: "01" }] },
  witness: { blocks: [{ target: "g", nodes: [a], zero: "0", one: "1" }], context },
});

describe("verify command", () => {
  it("verify exits 1 when the context omits a node named after any built-in property, 0 when it lists it", async () => {
    captureOutput();
    for (const b of BUILT_IN_NAMES) {
      expect(await verify([file("omit.json", swapJson("a", b, {}))])).toBe(1);
      const complete = JSON.parse(`{${JSON.stringify(b)}: 1}`) as Record<string, number>;
      expect(await verify([file("full.json", swapJson("a", b, complete))])).toBe(0);
    }
  });

  it("verify refuses time scales of 2e9 and 1e15 with the bound in its message", async () => {
    for (const time of [2e9, 1e15]) {
      const { out } = captureOutput();
      expect(await verify([file("long.json", swapJson("a", "b", { b: 1 }, time)), "--json"])).toBe(1);
      expect(JSON.parse(out.join(""))).toMatchObject({ valid: false, problems: ['"time" must be at most 65536'] });
      vi.restoreAllMocks();
    }
  });
});
