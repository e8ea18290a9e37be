// The run kinds for models beyond exact analysis (sat-cycles, trap-spaces, async-attractors): each plans one shard
// from the run's revision, and its task answers what plain references answer on small random networks: the exact
// synchronous state-space walk for cycles, and the exact asynchronous analysis for attractors.
import fc from "fast-check";
import seedrandom from "seedrandom";
import { MessageChannel } from "node:worker_threads";
import { describe, expect, it } from "vitest";
import { nkNetwork } from "@shared/engine/generators";
import { networkToDefinition, printRuleText } from "@shared/engine/rules";
import { analyseSynchronous, asynchronousAttractors, attractorsAsText } from "@shared/engine/state-graph";
import type { ShardTaskInput, ShardTaskOutput } from "../../workers/task-protocol";
import asyncAttractorsTask from "../../workers/tasks/async-attractors";
import satCyclesTask from "../../workers/tasks/sat-cycles";
import { RunRequestError } from "../run-errors";
import { asyncAttractorsKind } from "./async-attractors";
import { satCyclesKind } from "./sat-cycles";
import { trapSpacesKind } from "./trap-spaces";

async function runTask<P>(task: (input: ShardTaskInput) => Promise<ShardTaskOutput>, input: unknown): Promise<P> {
  const { port1, port2 } = new MessageChannel();
  const out = await task({
    input,
    cursor: null,
    partial: null,
    port: port2,
    stopFlag: new Int32Array(new SharedArrayBuffer(4)),
  });
  port1.close();
  if (!out.ok) throw new Error(out.error.message);
  return out.partial as P;
}

const smallNetwork = fc
  .record({ n: fc.integer({ min: 2, max: 8 }), k: fc.integer({ min: 1, max: 3 }), seed: fc.integer() })
  .map(({ n, k, seed }) => nkNetwork({ n, k: Math.min(k, n), random: seedrandom(String(seed)) }));

describe("large-model run kinds", () => {
  it("plan(params, revision) gives one shard with the revision's rule text, and refuses a run without a revision", () => {
    const revision = { ruleText: "a' = !b\nb' = !a" };
    expect(satCyclesKind.plan({ maxLength: 3, maxSolutions: 10 }, revision)).toEqual([
      { ruleText: revision.ruleText, maxLength: 3, maxSolutions: 10 },
    ]);
    expect(trapSpacesKind.plan({ kind: "maximal", limit: 5 }, revision)).toEqual([
      { ruleText: revision.ruleText, kind: "maximal", limit: 5 },
    ]);
    expect(() => asyncAttractorsKind.plan({ trapSpaceLimit: 5 }, null)).toThrow(RunRequestError);
  });

  it("the sat-cycles task lists exactly the synchronous attractors of length up to maxLength that the exact walk finds", async () => {
    await fc.assert(
      fc.asyncProperty(smallNetwork, fc.integer({ min: 1, max: 4 }), async (net, maxLength) => {
        const ruleText = printRuleText(networkToDefinition(net));
        const got = await runTask<{ cycles: { length: number; states: string[] }[]; complete: boolean }>(
          satCyclesTask,
          { ruleText, maxLength, maxSolutions: 1000 },
        );
        const exact = attractorsAsText(analyseSynchronous(net))
          .filter((a) => a.length <= maxLength)
          .map((a) => [...a.states].sort().join(","))
          .sort();
        expect(got.complete).toBe(true);
        expect(got.cycles.map((c) => [...c.states].sort().join(",")).sort()).toEqual(exact);
      }),
      { seed: 1201, numRuns: 40 },
    );
  });

  it("the async-attractors task on a small network is proved complete and matches the exact asynchronous analysis", async () => {
    await fc.assert(
      fc.asyncProperty(smallNetwork, async (net) => {
        const ruleText = printRuleText(networkToDefinition(net));
        const got = await runTask<{ completeness: string; attractors: { size: number }[] }>(asyncAttractorsTask, {
          ruleText,
          trapSpaceLimit: 1000,
        });
        expect(got.completeness).toBe("proved complete");
        const sizes = (xs: { size: number }[]) => xs.map((a) => a.size).sort((a, b) => a - b);
        expect(sizes(got.attractors)).toEqual(sizes(asynchronousAttractors(net).attractors));
      }),
      { seed: 1202, numRuns: 40 },
    );
  });
});
