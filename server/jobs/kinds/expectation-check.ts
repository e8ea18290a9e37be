// "expectation-check": every expectation of a model on one revision. Shards hold whole condition groups, so each
// condition is analysed once; results come back in the table's order and are stored (with break flags) on merge.
import { groupByCondition, type Expectation, type ExpectationResult } from "@shared/engine/expectations";
import { ExpectationCheckParams } from "@shared/schemas/expectations";
import { expectationCheckTask, type ExpectationCheckShard } from "@shared/schemas/run-tasks";
import { storeCheckResults } from "../../services/expectations/expectation-check";
import { RunRequestError } from "../run-errors";
import { defineRunKind, taskFile } from "../run-kind";

const MAX_SHARDS = 4;

export const expectationCheckKind = defineRunKind({
  kind: "expectation-check",
  params: ExpectationCheckParams,
  task: { ...expectationCheckTask, file: taskFile("expectation-check") },
  timeLimitSeconds: 3600,
  plan(p, revision) {
    if (!revision) throw new RunRequestError(400, "INVALID_INPUT", "An expectation check needs a model revision");
    const expectations = p.items.map((i) => i.expectation as Expectation);
    const groups = groupByCondition(expectations);
    const shardCount = Math.min(MAX_SHARDS, groups.length);
    const shards: ExpectationCheckShard[] = Array.from({ length: shardCount }, () => ({
      ruleText: revision.ruleText,
      items: [],
    }));
    groups.forEach((group, g) => {
      for (const index of group) shards[g % shardCount]!.items.push({ index, expectation: expectations[index] });
    });
    return shards;
  },
  merge(partials) {
    const results: ExpectationResult[] = [];
    for (const p of partials) for (const r of p.results) results[r.index] = r.result;
    return { results };
  },
  afterMerge: (trx, run, result, params) =>
    storeCheckResults(
      trx,
      run,
      (result as { results: ExpectationResult[] }).results,
      ExpectationCheckParams.parse(params),
    ),
});
