import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { afterEach, describe, expect, it, vi } from "vitest";
import { captureOutput } from "../capture-output.test-support";
import { run } from "./attractors";

const fixture = fileURLToPath(new URL("../../../tests/fixtures/sbml/faure-2006-cell-cycle.rules", import.meta.url));

afterEach(() => vi.restoreAllMocks());

describe("attractors command", () => {
  it("run with --json prints one object with the fixed point and the 7-state cycle of the Faure et al. (2006) cell-cycle model", async () => {
    // Faure, Naldi, Chaouiya, Thieffry, "Dynamical analysis of a generic Boolean model for the control of the
    // mammalian cell cycle", Bioinformatics 2006: under synchronous update, a stable state when CycD is off and a
    // single cycle of 7 states when CycD is on (values from memory; the fixture's rules are also from memory).
    const { out } = captureOutput();
    expect(await run([fixture, "--json"])).toBe(0);
    expect(out).toHaveLength(1);
    const result = JSON.parse(out[0]!) as {
      nodes: string[];
      stateCount: number;
      attractors: { length: number; basin: number; states: string[] }[];
    };
    expect(Object.keys(result)).toEqual(["nodes", "stateCount", "attractors"]);
    expect(result.nodes).toEqual(["CycD", "Rb", "E2F", "CycE", "CycA", "p27", "Cdc20", "Cdh1", "UbcH10", "CycB"]);
    expect(result.stateCount).toBe(1024);
    expect(result.attractors.map((a) => [a.length, a.basin])).toEqual([
      [1, 512],
      [7, 512],
    ]);
    expect(Object.keys(result.attractors[0]!)).toEqual(["length", "basin", "states"]);
    const cycle = result.attractors[1]!.states;
    expect(cycle.every((s) => s[0] === "1")).toBe(true);
    expect([...cycle].sort()[0]).toBe(cycle[0]);
    // The fixed point has Rb, p27 and Cdh1 on: the quiescent state without growth signal.
    expect(result.attractors[0]!.states).toEqual(["0100010100"]);
  });

  it("run without --json prints a readable table with one line per attractor", async () => {
    const { out } = captureOutput();
    expect(await run([fixture])).toBe(0);
    const text = out.join("");
    expect(text).toMatch(/10 nodes, 1024 states, 2 attractor\(s\)/);
    expect(text).toMatch(/\n +2 +7 +512 +50\.0%/);
  });

  it("run reports a rule-text error with file, line and column and exits with 1", async () => {
    const dir = mkdtempSync(path.join(tmpdir(), "emulant-attractors-"));
    const file = path.join(dir, "bad.rules");
    writeFileSync(file, "A' = A\nB' = (A &\n");
    const { err } = captureOutput();
    expect(await run([file, "--json"])).toBe(1);
    expect(err.join("")).toMatch(/bad\.rules:2:\d+: /);
  });

  it("run refuses a missing file argument, an unknown option and an unknown extension with exit code 2", async () => {
    captureOutput();
    expect(await run([])).toBe(2);
    expect(await run([fixture, "--fast"])).toBe(2);
    expect(await run(["model.json"])).toBe(2);
  });
});
