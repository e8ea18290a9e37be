// "reduction-search": given-target, discover and coarse-graining searches (server/reductions/search-plan.ts). The
// merged findings become proposed reductions in the same transaction that marks the run succeeded.
import { ReductionSearchParams } from "@shared/schemas/reductions";
import { mergeSearch, planSearch, type ShardPartial } from "../../reductions/search-plan";
import { storeSearchFindings } from "../../reductions/store-findings";
import { taskFile, type RunKindDefinition } from "../run-kind";

export const reductionSearchKind: RunKindDefinition<ReductionSearchParams> = {
  kind: "reduction-search",
  params: ReductionSearchParams,
  taskFile: taskFile("reduction-search"),
  timeLimitSeconds: 3 * 3600,
  plan: (params) => planSearch(params).map((shard) => ({ params, shard })),
  merge: (partials, params) => mergeSearch(params, partials as ShardPartial[]),
  afterMerge: (trx, run, result, params) => storeSearchFindings(trx, run, result, params),
};
