// "sat-cycles": fixed points and synchronous cycles up to a length by SAT (shared/engine/sat), for models beyond
// exact state-space analysis. One shard: the solver enumerates one length after another.
import { satCyclesTask } from "@shared/schemas/run-tasks";
import { SatCyclesParams } from "@shared/schemas/runs";
import { defineRunKind, taskFile } from "../run-kind";
import { revisionRuleText } from "./revision-rule-text";

export const satCyclesKind = defineRunKind({
  kind: "sat-cycles",
  params: SatCyclesParams,
  task: { ...satCyclesTask, file: taskFile("sat-cycles") },
  timeLimitSeconds: 3600,
  plan: (p, revision) => [{ ruleText: revisionRuleText("sat-cycles", revision), ...p }],
  merge: (partials) => partials[0],
});
