import { afterEach, describe, expect, it, vi } from "vitest";
import { captureOutput } from "../capture-output.test-support";
import { run } from "./eca-hierarchy";

afterEach(() => vi.restoreAllMocks());

describe("eca-hierarchy command", () => {
  it("run prints maxBlock, the sorted relations with least block sizes and the rules that emulate nothing", async () => {
    const io = captureOutput();
    expect(await run(["--max-block", "2", "--json"])).toBe(0);
    const doc = JSON.parse(io.out.join(""));
    expect(Object.keys(doc)).toEqual(["maxBlock", "relations", "emulateNothing"]);
    expect(doc.maxBlock).toBe(2);
    expect(Object.keys(doc.relations[0])).toEqual(["source", "target", "minBlock"]);
    const keys = doc.relations.map((r: { source: number; target: number }) => 256 * r.source + r.target);
    expect(keys).toEqual([...keys].sort((a: number, b: number) => a - b));
    // k = 1: every rule emulates itself and its complement conjugate (e.g. 110 -> 137)
    expect(doc.relations).toContainEqual({ source: 110, target: 137, minBlock: 1 });
    expect(doc.relations).toContainEqual({ source: 204, target: 204, minBlock: 1 });
    expect(doc.emulateNothing).not.toContain(204);
  });

  it("run rejects a missing or out-of-range --max-block on stderr with exit code 2", async () => {
    for (const args of [
      [],
      ["--max-block"],
      ["--max-block", "0"],
      ["--max-block", "99"],
      ["--max-block", "3", "--x"],
    ]) {
      const io = captureOutput();
      expect(await run(args)).toBe(2);
      expect(io.err.join("")).toMatch(/eca-hierarchy: .+\nusage:/);
      vi.restoreAllMocks();
    }
  });
});
