// "node-elimination": a smaller model of the run's revision by node elimination or percolation of constants
// (shared/engine/elimination), in one shard: substitution grows truth tables, so it never runs on a request.
import { nodeEliminationTask } from "@shared/schemas/run-tasks";
import { NodeEliminationParams } from "@shared/schemas/runs";
import { defineRunKind, taskFile } from "../run-kind";
import { revisionRuleText } from "./revision-rule-text";

export const nodeEliminationKind = defineRunKind({
  kind: "node-elimination",
  params: NodeEliminationParams,
  task: { ...nodeEliminationTask, file: taskFile("node-elimination") },
  timeLimitSeconds: 3600,
  plan: (params, revision) => [{ ruleText: revisionRuleText("node-elimination", revision), params }],
  merge: (partials) => partials[0],
});
