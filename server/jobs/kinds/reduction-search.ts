// "reduction-search": given-target, discover and coarse-graining searches (server/services/reductions/search-plan.ts).
// The merged findings become proposed reductions in the same transaction that marks the run succeeded.
import { ReductionSearchParams } from "@shared/schemas/reductions";
import { reductionSearchTask } from "@shared/schemas/run-tasks";
import { mergeSearch, planSearch } from "../../services/reductions/search-plan";
import { storeSearchFindings } from "../../services/reductions/store-findings";
import { defineRunKind, taskFile } from "../run-kind";

export const reductionSearchKind = defineRunKind({
  kind: "reduction-search",
  params: ReductionSearchParams,
  task: { ...reductionSearchTask, file: taskFile("reduction-search") },
  timeLimitSeconds: 3 * 3600,
  plan: (params) => planSearch(params).map((shard) => ({ params, shard })),
  merge: (partials, params) => mergeSearch(params, partials),
  afterMerge: (trx, run, result, params) => storeSearchFindings(trx, run, result, params),
});
