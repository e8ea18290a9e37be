// Thin wrapper: rule text in, synchronous attractors (states as 0/1 text) and transient figures out.
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { analyseSynchronous, attractorsAsText } from "@shared/engine/state-graph";
import { attractorsTask } from "@shared/schemas/run-tasks";
import { shardTask } from "../task-context";

export default shardTask(attractorsTask, ({ input }, ctx) => {
  const network = compileDefinition(readRuleText(input.ruleText));
  const analysis = analyseSynchronous(network, { onProgress: ctx.onProgress, shouldStop: ctx.shouldStop });
  return {
    nodeNames: [...network.names],
    stateCount: analysis.stateCount,
    maxTransient: analysis.maxTransient,
    meanTransient: analysis.meanTransient,
    attractors: attractorsAsText(analysis),
  };
});
