import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { afterEach, describe, expect, it, vi } from "vitest";
import { YEAST_RULE_TEXT } from "@shared/engine/rules/yeast-rule-text.test-support";
import { captureOutput } from "../capture-output.test-support";
import { run } from "./check";

afterEach(() => vi.restoreAllMocks());

const FIXTURE = fileURLToPath(
  new URL("../../../tests/fixtures/expectations/li-2004-yeast-cell-cycle.csv", import.meta.url),
);

function files(entries: Record<string, string>): Record<string, string> {
  const dir = mkdtempSync(path.join(tmpdir(), "emulant-check-"));
  return Object.fromEntries(
    Object.entries(entries).map(([name, text]) => {
      writeFileSync(path.join(dir, name), text);
      return [name, path.join(dir, name)];
    }),
  );
}

describe("check command", () => {
  it("passes every expectation of the Li et al. (PNAS 2004) yeast fixture and prints one JSON result per row", async () => {
    // Li, Long, Lu, Ouyang, Tang, "The yeast cell-cycle network is robustly designed", PNAS 2004 (values from memory).
    const model = files({ "yeast.rules": YEAST_RULE_TEXT })["yeast.rules"]!;
    const { out } = captureOutput();
    expect(await run([model, "--expectations", FIXTURE, "--json"])).toBe(0);
    const { results } = JSON.parse(out.join("")) as {
      results: { id: string; status: string; method: string; detail: string }[];
    };
    expect(results).toHaveLength(11);
    for (const r of results) expect([r.status, r.method]).toEqual(["pass", "exact-synchronous"]);
    expect(results[0]).toMatchObject({ id: "li2004-fixed-points", detail: "7 fixed points; expected exactly 7" });
  });

  it("exits 1 when an expectation fails and prints a readable table without --json", async () => {
    const paths = files({
      "toggle.rules": "A' = !B\nB' = !A\n",
      "table.csv":
        "id,outcome,pattern,count,source\nboth,some-attractor,A=1; B=1,,Notebook 1\ntwo,fixed-point-count,,2,Notebook 2\n",
    });
    const { out } = captureOutput();
    expect(await run([paths["toggle.rules"]!, "--expectations", paths["table.csv"]!])).toBe(1);
    const text = out.join("");
    expect(text).toMatch(/^FAIL {6}both {2}exact-synchronous {6}none of the 3 attractors has A=1; B=1$/m);
    expect(text).toMatch(/^PASS {6}two /m);
    expect(text).toMatch(/1 passed, 1 failed, 0 undecided/);
  });

  it("exits 1 with every table error as file:line:column: reason, and 2 for a usage error", async () => {
    const paths = files({
      "toggle.rules": "A' = !B\nB' = !A\n",
      "bad.csv": "id,outcome,pattern,source\ne1,some-attractor,A=3,src\ne2,sometimes,,src\n",
    });
    const { err } = captureOutput();
    expect(await run([paths["toggle.rules"]!, "--expectations", paths["bad.csv"]!, "--json"])).toBe(1);
    expect(err.join("")).toContain(`${paths["bad.csv"]}:2:21: expected 0 or 1 for A, found "3"`);
    expect(err.join("")).toContain(`${paths["bad.csv"]}:3:4: unknown outcome "sometimes"`);
    expect(await run([paths["toggle.rules"]!])).toBe(2);
    expect(await run([paths["toggle.rules"]!, "--expectations", paths["bad.csv"]!, "--max-cycle-length", "0"])).toBe(2);
  });

  it("warns about a node the model lacks and leaves that expectation undecided without failing", async () => {
    const paths = files({
      "toggle.rules": "A' = !B\nB' = !A\n",
      "table.csv": "id,outcome,pattern,source\ncyst,some-attractor,Cyst=1,Notebook 3\n",
    });
    const { out, err } = captureOutput();
    expect(await run([paths["toggle.rules"]!, "--expectations", paths["table.csv"]!, "--json"])).toBe(0);
    expect(JSON.parse(out.join("")).results[0]).toMatchObject({
      status: "undecided",
      method: "none",
      reason: "unknown-node",
    });
    expect(err.join("")).toContain("expectation cyst: the outcome names node Cyst, not in this model");
  });
});
