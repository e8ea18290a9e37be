import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it, vi } from "vitest";
import { captureOutput } from "../capture-output.test-support";
import { run as runCoarseGrain } from "./coarse-grain";
import { run as runEliminate } from "./eliminate";
import { run as runAsync } from "./async-attractors";
import { run } from "./trap-spaces";

afterEach(() => vi.restoreAllMocks());

const file = (name: string, text: string) => {
  const p = path.join(mkdtempSync(path.join(tmpdir(), "emulant-large-")), name);
  writeFileSync(p, text);
  return p;
};

// Two toggle switches (x' = !y, y' = !x) and a chain of 60 followers of the first: each toggle settles in one of two
// states (common practice), so there are four minimal trap spaces, all fixed points of the 64-node network.
function togglesWithFollowers(): string {
  const lines = ["x1' = !y1", "y1' = !x1", "x2' = !y2", "y2' = !x2", "f1' = x1"];
  for (let i = 2; i <= 60; i++) lines.push(`f${i}' = f${i - 1}`);
  return lines.join("\n") + "\n";
}

describe("trap-spaces command", () => {
  it("prints the four fixed points of a 64-node network as minimal trap spaces fixing every node", async () => {
    const { out } = captureOutput();
    expect(await run([file("t.rules", togglesWithFollowers()), "--json"])).toBe(0);
    const result = JSON.parse(out.join("")) as {
      nodes: string[];
      kind: string;
      complete: boolean;
      trapSpaces: { fixed: Record<string, number> }[];
    };
    expect(Object.keys(result).sort()).toEqual(["complete", "kind", "nodes", "trapSpaces"]);
    expect(result.kind).toBe("minimal");
    expect(result.complete).toBe(true);
    expect(result.trapSpaces).toHaveLength(4);
    for (const t of result.trapSpaces) {
      expect(Object.keys(t.fixed)).toHaveLength(64);
      expect(t.fixed.x1).toBe(1 - t.fixed.y1!);
      expect(t.fixed.f60).toBe(t.fixed.x1);
    }
  });

  it("with --maximal --limit 1 lists one maximal trap space and says the list is incomplete", async () => {
    const { out } = captureOutput();
    expect(await run([file("t.rules", togglesWithFollowers()), "--maximal", "--limit", "1", "--json"])).toBe(0);
    const result = JSON.parse(out.join("")) as { kind: string; complete: boolean; trapSpaces: unknown[] };
    expect(result.kind).toBe("maximal");
    expect(result.complete).toBe(false);
    expect(result.trapSpaces).toHaveLength(1);
  });

  it("reports a parse error as file:line:column with exit code 1, and a bad --limit with exit code 2", async () => {
    const { err } = captureOutput();
    const bad = file("bad.rules", "a' = a &\n");
    expect(await run([bad, "--json"])).toBe(1);
    expect(err.join("")).toMatch(new RegExp(`${bad.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}:1:\\d+: `));
    expect(await run([bad, "--limit", "0"])).toBe(2);
  });
});

describe("eliminate command", () => {
  it("with --all-eligible prints the reduced rule text, the eliminated nodes and what is preserved", async () => {
    const { out } = captureOutput();
    expect(await runEliminate([file("t.rules", togglesWithFollowers()), "--all-eligible", "--json"])).toBe(0);
    const result = JSON.parse(out.join("")) as { eliminated: string[]; ruleText: string; preserves: string };
    // Every node is eligible; the toggles collapse onto self-regulated nodes and the followers disappear.
    expect(result.eliminated.length).toBeGreaterThanOrEqual(62);
    expect(result.preserves).toMatch(/^Fixed points, one to one/);
    expect(result.ruleText.trim().split("\n").length).toBe(64 - result.eliminated.length);
  });

  it("with --percolate --hold fixes what follows from a held input", async () => {
    const { out } = captureOutput();
    const f = file("p.rules", "s' = s\na' = s\nb' = a | b\nc' = !c & a\n");
    expect(await runEliminate([f, "--percolate", "--hold", "s=1", "--json"])).toBe(0);
    const result = JSON.parse(out.join("")) as { fixed: Record<string, number>; ruleText: string };
    expect(result.fixed).toEqual({ s: 1, a: 1, b: 1 });
    expect(result.ruleText).toBe("c' = !c\n");
  });

  it("refuses two modes at once, and an unknown node, with exit codes 2 and 1", async () => {
    captureOutput();
    const f = file("p.rules", "a' = a\n");
    expect(await runEliminate([f, "--nodes", "a", "--all-eligible"])).toBe(2);
    expect(await runEliminate([f, "--nodes", "zz"])).toBe(1);
  });
});

describe("coarse-grain command on a large source", () => {
  it("decides closure by SAT above the tabulation limit, with a certificate or a counterexample", async () => {
    // A repressor ring (a' = !c, b' = !a, c' = !b) reads only itself; 40 followers of a make the source 43 nodes.
    const lines = ["a' = !c", "b' = !a", "c' = !b", "f1' = a"];
    for (let i = 2; i <= 40; i++) lines.push(`f${i}' = f${i - 1}`);
    const f = file("ring.rules", lines.join("\n") + "\n");
    const { out } = captureOutput();
    expect(await runCoarseGrain([f, "--observe", "a,b,c", "--json"])).toBe(0);
    const closes = JSON.parse(out.join("")) as { closes: boolean; method: string; witness: { notion: string } };
    expect(closes.closes).toBe(true);
    expect(closes.witness.notion).toBe("coarse-graining");
    out.length = 0;
    expect(await runCoarseGrain([f, "--observe", "f2", "--json"])).toBe(0);
    const fails = JSON.parse(out.join("")) as { closes: boolean; counterexample: { differingNodes: string[] } };
    expect(fails.closes).toBe(false);
    expect(fails.counterexample.differingNodes).toEqual(["f2"]);
  });
});

describe("async-attractors command", () => {
  it("prints one cyclic attractor of a repressor ring, proved complete, as JSON", async () => {
    // An odd ring of three repressors has no fixed point and, under asynchronous update, one cyclic attractor of six
    // states: all states but 000 and 111, which lead into it (common practice for negative loops).
    const { out } = captureOutput();
    expect(await runAsync([file("ring.rules", "a' = !c\nb' = !a\nc' = !b\n"), "--json"])).toBe(0);
    const report = JSON.parse(out.join("")) as {
      completeness: string;
      attractors: { size: number; states: string[] }[];
    };
    expect(report.completeness).toBe("proved complete");
    expect(report.attractors).toHaveLength(1);
    expect(report.attractors[0]!.size).toBe(6);
    expect(report.attractors[0]!.states).not.toContain("000");
  });
});
