// Thin wrapper: rule text in, minimal or maximal trap spaces (as patterns) out.
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { trapSpaces } from "@shared/engine/trap-spaces";
import { trapSpacesTask } from "@shared/schemas/run-tasks";
import { shardTask } from "../task-context";

export default shardTask(trapSpacesTask, ({ input }, ctx) => {
  const network = compileDefinition(readRuleText(input.ruleText));
  const r = trapSpaces(network, {
    kind: input.kind,
    limit: input.limit,
    onProgress: ctx.onProgress,
    shouldStop: ctx.shouldStop,
  });
  return {
    nodes: r.nodes,
    kind: r.kind,
    complete: r.complete,
    trapSpaces: r.trapSpaces.map((t) => ({ pattern: t.pattern })),
    percolatedNodes: r.percolatedNodes,
  };
});
