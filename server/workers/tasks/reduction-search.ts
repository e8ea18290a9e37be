// Thin wrapper: one shard of a reduction search. Block-emulation shards checkpoint their cursor (every unit before
// it holds no witness), so a restarted worker resumes the shard instead of repeating it.
import type { ReductionSearchParams } from "@shared/schemas/reductions";
import { runSearchShard, type SearchShard } from "../../reductions/search-plan";
import { runTask } from "../task-context";
import type { ShardTaskInput } from "../task-protocol";

export default function reductionSearchTask(task: ShardTaskInput) {
  return runTask(task, (ctx) => {
    const { params, shard } = task.input as { params: ReductionSearchParams; shard: SearchShard };
    let fraction = 0;
    let phase = "searching";
    return runSearchShard(params, shard, {
      shouldStop: ctx.shouldStop,
      onProgress: (f, p) => {
        fraction = f;
        phase = p;
        ctx.onProgress(f, p);
      },
      resumeFrom: typeof task.cursor === "number" ? task.cursor : undefined,
      onCursor: (cursor) => ctx.checkpoint(fraction, phase, cursor, null),
    });
  });
}
