// Thin wrapper: rule text in, fixed points (by the clause encoding) or every cycle up to maxLength out.
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { satCycles, satFixedPoints } from "@shared/engine/sat";
import { satCyclesTask } from "@shared/schemas/run-tasks";
import { shardTask } from "../task-context";

export default shardTask(satCyclesTask, ({ input }, ctx) => {
  const network = compileDefinition(readRuleText(input.ruleText));
  const options = { maxSolutions: input.maxSolutions, onProgress: ctx.onProgress, shouldStop: ctx.shouldStop };
  // Fixed points alone go through the much faster clause encoding.
  const search =
    input.maxLength === 1
      ? (() => {
          const r = satFixedPoints(network, options);
          return { cycles: r.states.map((s) => ({ length: 1, states: [s] })), complete: r.complete };
        })()
      : satCycles(network, input.maxLength, options);
  return { nodes: [...network.names], maxLength: input.maxLength, cycles: search.cycles, complete: search.complete };
});
