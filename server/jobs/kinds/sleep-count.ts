// "sleep-count": the deterministic, sharded demonstration kind used by tests and the benchmark. It splits
// [0, itemCount) into contiguous shards; merging adds the shards' counts, so a lost or doubled shard shows.
import { sleepCountTask, type SleepCountShard } from "@shared/schemas/run-tasks";
import { SleepCountParams, type SleepCountResult } from "@shared/schemas/runs";
import { defineRunKind, taskFile } from "../run-kind";

export const sleepCountKind = defineRunKind({
  kind: "sleep-count",
  params: SleepCountParams,
  task: { ...sleepCountTask, file: taskFile("sleep-count") },
  timeLimitSeconds: 3600,
  plan(p) {
    const shardCount = Math.min(p.shardCount, p.itemCount);
    const shards: SleepCountShard[] = [];
    for (let i = 0; i < shardCount; i++) {
      shards.push({
        from: Math.floor((i * p.itemCount) / shardCount),
        to: Math.floor(((i + 1) * p.itemCount) / shardCount),
        delayMsPerItem: p.delayMsPerItem,
      });
    }
    return shards;
  },
  merge(partials): SleepCountResult {
    const out: SleepCountResult = { itemCount: 0, sum: 0, oddCount: 0 };
    for (const p of partials) {
      out.itemCount += p.itemCount;
      out.sum += p.sum;
      out.oddCount += p.oddCount;
    }
    return out;
  },
});
