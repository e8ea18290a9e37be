// "async-attractors": attractors under general asynchronous update, exact up to the engine's limit and located
// through minimal trap spaces beyond it (shared/engine/trap-spaces/trap-space-attractors.ts), in one shard.
import { asyncAttractorsTask } from "@shared/schemas/run-tasks";
import { AsyncAttractorsParams } from "@shared/schemas/runs";
import { defineRunKind, taskFile } from "../run-kind";
import { revisionRuleText } from "./revision-rule-text";

export const asyncAttractorsKind = defineRunKind({
  kind: "async-attractors",
  params: AsyncAttractorsParams,
  task: { ...asyncAttractorsTask, file: taskFile("async-attractors") },
  timeLimitSeconds: 3600,
  plan: (p, revision) => [{ ruleText: revisionRuleText("async-attractors", revision), ...p }],
  merge: (partials) => partials[0],
});
