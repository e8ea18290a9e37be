import { afterEach, describe, expect, it, vi } from "vitest";
import { captureOutput } from "../capture-output.test-support";
import { run } from "./eca-emulations";
import { ecaRule } from "@shared/engine/automata";
import { verifyEmulation } from "@shared/engine/block-emulation";

afterEach(() => vi.restoreAllMocks());

describe("eca-emulations command", () => {
  it("run prints the JSON document with targets ascending and witnesses the verifier accepts", async () => {
    const io = captureOutput();
    expect(await run(["--rule", "0", "--block", "3", "--json"])).toBe(0);
    expect(JSON.parse(io.out.join(""))).toEqual({
      rule: 0,
      block: 3,
      time: 3,
      emulations: [
        { target: 0, encoding: { "0": "000", "1": expect.any(String) } },
        { target: 255, encoding: { "0": expect.any(String), "1": "000" } },
      ],
    });
  });

  it("run honours --time and every printed encoding is a valid witness", async () => {
    const io = captureOutput();
    expect(await run(["--rule", "1", "--block", "4", "--time", "2", "--json"])).toBe(0);
    const doc = JSON.parse(io.out.join(""));
    expect(doc.time).toBe(2);
    for (const e of doc.emulations)
      expect(verifyEmulation(ecaRule(1), e.target, e.encoding["0"], e.encoding["1"], 2).valid).toBe(true);
  });

  it("run rejects bad arguments on stderr with exit code 2", async () => {
    for (const args of [
      ["--rule", "256", "--block", "3"],
      ["--block", "3"],
      ["--rule", "1", "--block", "0"],
      ["--rule", "1", "--block", "3", "--time", "4"],
      ["--rule", "1", "--block", "3", "--frob"],
      ["--rule", "x", "--block", "3"],
    ]) {
      const io = captureOutput();
      expect(await run(args)).toBe(2);
      expect(io.err.join("")).toMatch(/eca-emulations: .+\nusage:/);
      expect(io.out).toEqual([]);
      vi.restoreAllMocks();
    }
  });
});
