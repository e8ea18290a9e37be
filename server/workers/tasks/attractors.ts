// Thin wrapper: rule text in, synchronous attractors (states as 0/1 text) and transient figures out.
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { analyseSynchronous, attractorsAsText } from "@shared/engine/state-graph";
import { runTask } from "../task-context";
import type { ShardTaskInput } from "../task-protocol";

export default function attractorsTask(task: ShardTaskInput) {
  return runTask(task, (ctx) => {
    const { ruleText } = task.input as { ruleText: string };
    const network = compileDefinition(readRuleText(ruleText));
    const analysis = analyseSynchronous(network, { onProgress: ctx.onProgress, shouldStop: ctx.shouldStop });
    return {
      nodeNames: network.names,
      stateCount: analysis.stateCount,
      maxTransient: analysis.maxTransient,
      meanTransient: analysis.meanTransient,
      attractors: attractorsAsText(analysis),
    };
  });
}
