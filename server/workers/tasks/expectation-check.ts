// Thin wrapper: rule text and some expectations in, one result each out, every one decided by the method that fits
// the model's size (exact, then SAT; minimal trap spaces for asynchronous outcomes on large models).
import type { Expectation } from "@shared/engine/expectations";
import { evaluateExpectations, trapSpaceMethod } from "@shared/engine/expectations";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { expectationCheckTask } from "@shared/schemas/run-tasks";
import { shardTask } from "../task-context";

export default shardTask(expectationCheckTask, ({ input }, ctx) => {
  const network = compileDefinition(readRuleText(input.ruleText));
  const expectations = input.items.map((item) => item.expectation as Expectation);
  const results = evaluateExpectations(network, expectations, {
    onProgress: ctx.onProgress,
    shouldStop: ctx.shouldStop,
    methods: [trapSpaceMethod()],
  });
  return { results: results.map((result, q) => ({ index: input.items[q]!.index, result })) };
});
