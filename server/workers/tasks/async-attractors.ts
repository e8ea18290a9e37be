// Thin wrapper: rule text in, the asynchronous attractor report (proved complete or found so far) out.
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { asynchronousAttractorReport } from "@shared/engine/trap-spaces";
import { asyncAttractorsTask } from "@shared/schemas/run-tasks";
import { shardTask } from "../task-context";

export default shardTask(asyncAttractorsTask, ({ input }, ctx) => {
  const network = compileDefinition(readRuleText(input.ruleText));
  const r = asynchronousAttractorReport(network, {
    trapSpaceLimit: input.trapSpaceLimit,
    onProgress: ctx.onProgress,
    shouldStop: ctx.shouldStop,
  });
  return {
    ...r,
    attractors: r.attractors.map((a) => ({ ...a })),
    minimalTrapSpaces: r.minimalTrapSpaces.map((m) => ({ ...m, trapSpace: { pattern: m.trapSpace.pattern } })),
  };
});
