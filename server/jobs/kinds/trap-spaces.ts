// "trap-spaces": minimal or maximal trap spaces by SAT (shared/engine/trap-spaces), in one shard.
import { trapSpacesTask } from "@shared/schemas/run-tasks";
import { TrapSpacesParams } from "@shared/schemas/runs";
import { defineRunKind, taskFile } from "../run-kind";
import { revisionRuleText } from "./revision-rule-text";

export const trapSpacesKind = defineRunKind({
  kind: "trap-spaces",
  params: TrapSpacesParams,
  task: { ...trapSpacesTask, file: taskFile("trap-spaces") },
  timeLimitSeconds: 3600,
  plan: (p, revision) => [{ ruleText: revisionRuleText("trap-spaces", revision), ...p }],
  merge: (partials) => partials[0],
});
