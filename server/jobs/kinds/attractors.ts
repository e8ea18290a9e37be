// "attractors": exact synchronous attractors and basins of one network (one shard: the state space is walked
// once as a whole, see shared/engine/state-graph).
import { attractorsTask } from "@shared/schemas/run-tasks";
import { AttractorsParams } from "@shared/schemas/runs";
import { ruleTextIssues } from "../../services/models/model-reading";
import { RunRequestError } from "../run-errors";
import { defineRunKind, taskFile } from "../run-kind";

export const attractorsKind = defineRunKind({
  kind: "attractors",
  params: AttractorsParams,
  task: { ...attractorsTask, file: taskFile("attractors") },
  timeLimitSeconds: 3600,
  plan(p, revision) {
    const ruleText = p.ruleText ?? revision?.ruleText;
    if (!ruleText)
      throw new RunRequestError(400, "INVALID_INPUT", "An attractors run needs a model revision or rule text");
    // Text sent with the run is read here, so its mistakes come back with their place and its size stays bounded.
    if (p.ruleText) {
      const first = ruleTextIssues(p.ruleText).issues[0];
      if (first)
        throw new RunRequestError(
          400,
          "PARSE_ERROR",
          `params.ruleText: ${first.message} (line ${first.line}, column ${first.column})`,
        );
    }
    return [{ ruleText }];
  },
  merge: (partials) => partials[0],
});
