// Thin wrapper: one shard of a reduction search. Block-emulation shards checkpoint their cursor (every unit before
// it holds no witness), so a restarted worker resumes the shard instead of repeating it.
import { reductionSearchTask } from "@shared/schemas/run-tasks";
import { runSearchShard } from "../../services/reductions/search-plan";
import { shardTask } from "../task-context";

export default shardTask(reductionSearchTask, ({ input, cursor }, ctx) => {
  let fraction = 0;
  let phase = "searching";
  return runSearchShard(input.params, input.shard, {
    shouldStop: ctx.shouldStop,
    onProgress: (f, p) => {
      fraction = f;
      phase = p;
      ctx.onProgress(f, p);
    },
    resumeFrom: cursor ?? undefined,
    onCursor: (next) => ctx.checkpoint(fraction, phase, next, null),
  });
});
