import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, afterEach, describe, expect, it, vi } from "vitest";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { readSbmlQual } from "@shared/formats/sbml-qual";
import { readTruthTableCsv } from "@shared/formats/truth-table-csv";
import { captureOutput } from "../capture-output.test-support";
import { run } from "./convert";

const dir = mkdtempSync(join(tmpdir(), "emulant-convert-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
afterEach(() => vi.restoreAllMocks());

async function convert(args: string[]): Promise<{ code: number; out: string; err: string }> {
  const io = captureOutput();
  const code = await run(args);
  vi.restoreAllMocks();
  return { code, out: io.out.join(""), err: io.err.join("") };
}

const RULES = "# toggle switch with an input\nS' = S\nU' = S | !V\nV' = !U\n";

describe("convert command", () => {
  it("convert writes rule text as SBML-qual, truth tables and canonical rules to standard output", async () => {
    const file = join(dir, "toggle.rules");
    writeFileSync(file, RULES);
    const expected = compileDefinition(readRuleText(RULES));
    const sbml = await convert([file, "--to", "sbml"]);
    expect(sbml.code).toBe(0);
    expect(compileDefinition(readSbmlQual(sbml.out).definition)).toEqual(expected);
    const csv = await convert(["--to", "csv", file]);
    expect(csv.code).toBe(0);
    expect(readTruthTableCsv(csv.out)).toEqual(expected);
    const rules = await convert([file, "--to", "rules"]);
    expect(rules).toEqual({ code: 0, out: "S' = S\nU' = S | !V\nV' = !U\n", err: "" });
  });

  it("convert lists every error of a faulty rule file as file:line:column and exits 1", async () => {
    const file = join(dir, "bad.rules");
    writeFileSync(file, "A' = (B\nB = 1\n");
    const r = await convert([file, "--to", "sbml"]);
    expect(r.code).toBe(1);
    expect(r.out).toBe("");
    expect(r.err).toBe(
      `${file}:1:8: missing ")" to close "(" at column 6\n${file}:2:3: missing prime after B; write B' = ...\n`,
    );
  });

  it("convert exits 2 with usage for a missing --to, an unknown target or an unknown extension", async () => {
    expect((await convert(["x.rules"])).code).toBe(2);
    expect((await convert(["x.rules", "--to", "json"])).err).toMatch(/--to must be sbml, rules or csv/);
    expect((await convert(["x.json", "--to", "rules"])).err).toMatch(/cannot tell the format/);
  });
});
