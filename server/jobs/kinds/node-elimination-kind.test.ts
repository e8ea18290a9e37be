// The node-elimination run kind: one shard from the run's revision, and a task whose engine refusals (here the
// regulator limit) come back as the run's error with the engine's code and message, not as a crash.
import { MessageChannel } from "node:worker_threads";
import { describe, expect, it } from "vitest";
import { verifyCertificate } from "@shared/engine/certificates";
import { NodeEliminationResult } from "@shared/schemas/run-tasks";
import type { ShardTaskInput } from "../../workers/task-protocol";
import nodeEliminationTask from "../../workers/tasks/node-elimination";
import { RunRequestError } from "../run-errors";
import { nodeEliminationKind } from "./node-elimination";

async function runTask(input: unknown) {
  const { port1, port2 } = new MessageChannel();
  const task: ShardTaskInput = {
    input,
    cursor: null,
    partial: null,
    port: port2,
    stopFlag: new Int32Array(new SharedArrayBuffer(4)),
  };
  const out = await nodeEliminationTask(task);
  port1.close();
  return out;
}

// h reads 11 inputs and t reads h and 10 others: substituting h into t would give t 21 regulators.
const a = Array.from({ length: 11 }, (_, i) => `a${i}`);
const b = Array.from({ length: 10 }, (_, i) => `b${i}`);
const WIDE = [...[...a, ...b].map((x) => `${x}' = ${x}`), `h' = ${a.join(" & ")}`, `t' = h & ${b.join(" & ")}`].join(
  "\n",
);

describe("node-elimination run kind", () => {
  it("plans one shard with the revision's rule text and refuses a run without a revision", () => {
    const revision = { ruleText: "a' = !b\nb' = a\n" };
    expect(nodeEliminationKind.plan({ mode: "all-eligible" }, revision)).toEqual([
      { ruleText: revision.ruleText, params: { mode: "all-eligible" } },
    ]);
    expect(() => nodeEliminationKind.plan({ mode: "all-eligible" }, null)).toThrow(RunRequestError);
  });

  it("an elimination past the regulator limit ends with the engine's code and message", async () => {
    const out = await runTask({ ruleText: WIDE, params: { mode: "nodes", nodes: ["h"] } });
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.error).toEqual({
      code: "TOO_MANY_REGULATORS",
      message: 'eliminating "h" would give node "t" 21 regulators; at most 20 are supported',
    });
  });

  it("with all eligible nodes it keeps the node that would break the limit, says why, and the certificate verifies", async () => {
    // u reads t and itself: t goes first (u then reads h and the b's), and h would then give u 22 regulators.
    const out = await runTask({ ruleText: `${WIDE}\nu' = t & u`, params: { mode: "all-eligible" } });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    const result = NodeEliminationResult.parse(out.partial);
    expect(result.eliminated).toEqual(["t"]);
    expect(result.notEliminated).toContainEqual({
      node: "h",
      reason: "eliminating it would give a node 22 regulators (at most 20)",
    });
    expect(result.notEliminated).toContainEqual({ node: "u", reason: "regulates itself" });
    expect(verifyCertificate(result.certificate).valid).toBe(true);
  });

  it("a percolation that fixes every node leaves no model to save, and says so", async () => {
    const out = await runTask({ ruleText: "a' = 1\nb' = a\n", params: { mode: "percolate", hold: [] } });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    const result = NodeEliminationResult.parse(out.partial);
    expect(result.fixed).toEqual([
      { node: "a", value: 1 },
      { node: "b", value: 1 },
    ]);
    expect(result.certificate).toBeNull();
    expect(result.certificateNote).toBe("Every node was removed, so there is no reduced model to save.");
  });
});
