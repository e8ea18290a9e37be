// The reduction commands end to end on small files: the worked example of the README (F: P' = !Q, Q' = P emulates
// G: X' = !X at t = 2 with block {P, Q}), and verify's exit codes on a valid and a tampered certificate.
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it, vi } from "vitest";
import { verifyCertificate } from "@shared/engine/certificates";
import { captureOutput } from "../capture-output.test-support";
import { run as coarseGrain } from "./coarse-grain";
import { run as discover } from "./discover";
import { run as embed } from "./embed";
import { run as emulate } from "./emulate";
import { run as verify } from "./verify";

const dir = mkdtempSync(path.join(tmpdir(), "emulant-reductions-cli-"));
const file = (name: string, text: string) => {
  const p = path.join(dir, name);
  writeFileSync(p, text);
  return p;
};
const F = file("f.rules", "P' = !Q\nQ' = P\n");
const G = file("g.rules", "X' = !X\n");

afterEach(() => vi.restoreAllMocks());

async function json(cmd: (args: string[]) => Promise<number>, args: string[]) {
  const { out } = captureOutput();
  const code = await cmd(args);
  return { code, body: JSON.parse(out.join("")) };
}

describe("emulate, embed, coarse-grain, discover and verify commands", () => {
  it("emulate finds the worked example at t = 2 and reports its bounds when t = 1 is too short", async () => {
    const found = await json(emulate, ["--source", F, "--target", G, "--time", "2", "--json"]);
    expect(found.code).toBe(0);
    expect(found.body.found).toBe(true);
    expect(found.body.witness).toMatchObject({
      notion: "block-emulation",
      time: 2,
      witness: { blocks: [{ target: "X", nodes: ["P", "Q"] }], context: {} },
    });
    // Both 00/11 and 10/01 are valid codeword pairs here; any witness must pass the independent verifier.
    expect(verifyCertificate(found.body.witness).valid).toBe(true);
    const none = await json(emulate, ["--source", F, "--target", G, "--time", "1", "--json"]);
    expect(none.body).toEqual({ found: false, bounds: { maxTime: 1, maxBlock: 3, contextAllowed: true } });
  });

  it("verify exits 0 for the found certificate and 1 for a tampered one", async () => {
    const { body } = await json(emulate, ["--source", F, "--target", G, "--time", "2", "--json"]);
    const good = file("good.json", JSON.stringify(body.witness));
    captureOutput();
    expect(await verify([good])).toBe(0);
    const bad = structuredClone(body.witness);
    bad.witness.blocks[0].one = "10";
    expect(await verify([file("bad.json", JSON.stringify(bad))])).toBe(1);
    expect(await verify([file("not.json", "{ nope")])).toBe(1);
    expect(await verify([])).toBe(2);
  });

  it("embed finds G's 2-cycle inside F^2 but not inside F, whose only cycle has length 4", async () => {
    expect((await json(embed, ["--source", F, "--target", G, "--json"])).body.found).toBe(false);
    const two = await json(embed, ["--source", F, "--target", G, "--time", "2", "--json"]);
    expect(two.body).toMatchObject({ found: true, witness: { notion: "dynamical-embedding", time: 2 } });
  });

  it("coarse-grain closes on a node that reads only itself and reports the grouping size otherwise", async () => {
    const src = file("cg.rules", "A' = !A\nB' = A\nC' = B ^ C\n");
    const closes = await json(coarseGrain, [src, "--observe", "A", "--json"]);
    expect(closes.body).toMatchObject({ closes: true, groups: 2, witness: { notion: "coarse-graining" } });
    const open = await json(coarseGrain, [src, "--observe", "C", "--json"]);
    expect(open.body.closes).toBe(false);
    expect(open.body.groups).toBeGreaterThan(2);
  });

  it("discover lists the oscillator X' = !X among the targets of F at t = 2, not flagged trivial", async () => {
    const { code, body } = await json(discover, [F, "--max-target-nodes", "1", "--time", "2", "--json"]);
    expect(code).toBe(0);
    const oscillator = body.targets.find(
      (t: { nodes: number; witness: { target: { nodes: { table: string; inputs: string[] }[] } } }) =>
        t.nodes === 1 && t.witness.target.nodes[0]!.table === "10" && t.witness.target.nodes[0]!.inputs.length === 1,
    );
    expect(oscillator).toBeDefined();
    expect(oscillator.flags).not.toContain("trivial");
  });

  it("reports usage errors with exit code 2 and unreadable files with exit code 1", async () => {
    const { err } = captureOutput();
    expect(await emulate(["--source", F])).toBe(2);
    expect(await emulate(["--source", F, "--target", G, "--time", "x"])).toBe(2);
    expect(await discover([F, "--max-target-nodes", "9"])).toBe(2);
    expect(await emulate(["--source", path.join(dir, "missing.rules"), "--target", G])).toBe(1);
    expect(await emulate(["--source", file("broken.rules", "P' = (Q\n"), "--target", G])).toBe(1);
    expect(err.join("")).toMatch(/broken\.rules:1:\d+: /);
  });
});
