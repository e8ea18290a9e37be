import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it, vi } from "vitest";
import { captureOutput } from "../capture-output.test-support";
import { run } from "./cycles";

afterEach(() => vi.restoreAllMocks());

// A ring of three repressors (odd negative loop) drives a chain of 97 followers: 100 nodes, far past the exact
// analysis. An odd ring of NOT gates has no fixed point, one 2-cycle (all equal, flipping) and one 6-cycle on its
// other six states (common practice for negative loops); the followers only copy, so the whole network has the same
// cycles, each state extended by the ring's recent history.
function ringWithFollowers(): string {
  const lines = ["R1' = !R3", "R2' = !R1", "R3' = !R2", "F1' = R1"];
  for (let i = 2; i <= 97; i++) lines.push(`F${i}' = F${i - 1}`);
  return lines.join("\n") + "\n";
}

describe("cycles command", () => {
  it("finds exactly one 2-cycle and one 6-cycle, and no fixed point, in a 100-node network by SAT", async () => {
    const file = path.join(mkdtempSync(path.join(tmpdir(), "emulant-cycles-")), "ring.rules");
    writeFileSync(file, ringWithFollowers());
    const { out } = captureOutput();
    expect(await run([file, "--max-length", "6", "--json"])).toBe(0);
    const result = JSON.parse(out.join("")) as {
      nodes: string[];
      complete: boolean;
      cycles: { length: number; states: string[] }[];
    };
    expect(result.nodes).toHaveLength(100);
    expect(result.complete).toBe(true);
    expect(result.cycles.map((c) => c.length)).toEqual([2, 6]);
    const [two] = result.cycles;
    // On the 2-cycle the ring is all 0 or all 1, and every follower copies the ring's state of its distance ago.
    expect(two!.states.map((s) => s.slice(0, 3)).sort()).toEqual(["000", "111"]);
  });

  it("refuses a missing or out-of-range --max-length with exit code 2", async () => {
    captureOutput();
    expect(await run(["x.rules"])).toBe(2);
    expect(await run(["x.rules", "--max-length", "0"])).toBe(2);
  });
});
