import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it, vi } from "vitest";
import { captureOutput } from "../capture-output.test-support";
import { run } from "./screen";

afterEach(() => vi.restoreAllMocks());

function modelFile(text: string): string {
  const file = path.join(mkdtempSync(path.join(tmpdir(), "emulant-screen-")), "model.rules");
  writeFileSync(file, text);
  return file;
}

// A toggle switch (mutual repression, common practice) with a reporter of A: two fixed points and a 2-cycle.
const TOGGLE = "A' = !B\nB' = !A\nR' = A\n";

describe("screen command", () => {
  it("prints the rows sorted by basin share, with the perturbation, attractors before and after", async () => {
    const { out } = captureOutput();
    expect(await run([modelFile(TOGGLE), "--nodes", "A,B", "--phenotype", "R=1", "--json"])).toBe(0);
    const result = JSON.parse(out.join("")) as {
      phenotype: Record<string, number>;
      method: string;
      rows: {
        perturbation: Record<string, number>;
        basinShare: number;
        attractorsBefore: number;
        attractorsAfter: number;
      }[];
    };
    expect(result.phenotype).toEqual({ R: 1 });
    expect(result.method).toBe("exact-synchronous");
    // Holding A on (or B off) sends every state to A=1, R=1: the whole state space; the opposite holds none.
    expect(result.rows.map((r) => [r.perturbation, r.basinShare, r.attractorsBefore, r.attractorsAfter])).toEqual([
      [{ A: 1 }, 1, 3, 1],
      [{ B: 0 }, 1, 3, 1],
      [{ A: 0 }, 0, 3, 1],
      [{ B: 1 }, 0, 3, 1],
    ]);
  });

  it("adds the pairs with --pairs and prints a readable table without --json", async () => {
    const { out } = captureOutput();
    expect(await run([modelFile(TOGGLE), "--nodes", "A B", "--pairs", "--phenotype", "R=1"])).toBe(0);
    const text = out.join("");
    expect(text).toMatch(/8 perturbation\(s\), method exact-synchronous/);
    expect(text).toMatch(/unperturbed: 3 attractors, 1 with the phenotype, basin share 25.0%/);
    expect(text).toMatch(/^100.0% {2}1\/1 .* A over-expressed, B knocked out$/m);
  });

  it("exits 2 for a malformed --nodes or --phenotype and 1 for a node the model lacks", async () => {
    const { err } = captureOutput();
    const file = modelFile(TOGGLE);
    expect(await run([file, "--nodes", "A", "--phenotype", "R=2"])).toBe(2);
    expect(err.join("")).toContain('--phenotype "R=2", at character 3: expected 0 or 1 for R, found "2"');
    expect(await run([file, "--phenotype", "R=1"])).toBe(2);
    expect(await run([file, "--nodes", "A=1", "--phenotype", "R=1"])).toBe(2);
    expect(await run([file, "--nodes", "Z", "--phenotype", "R=1"])).toBe(1);
    expect(err.join("")).toContain("node Z is not in this model");
  });
});
