// Demonstration shard task: walks [from, to) one item at a time, sleeping delayMsPerItem per item (a stand-in for
// real work), and checkpoints every ~200 ms so a resumed shard continues where the last checkpoint left it.
// The sums stay exact integers (below 10^12, far inside 2^53) for the allowed item counts, so merged results compare exactly.
import { CancelledError } from "@shared/engine/errors";
import { sleepCountTask } from "@shared/schemas/run-tasks";
import { shardTask } from "../task-context";

const CHECKPOINT_EVERY_MS = 200;

/** The per-item function: a value that is cheap, deterministic and makes a double-counted item visible. */
export function itemValue(i: number): number {
  return (i * 7 + 3) % 1000;
}

export default shardTask(sleepCountTask, ({ input: shard, cursor: resumeAt, partial: resumed }, ctx) => {
  let cursor = resumeAt ?? shard.from;
  const partial = resumed ?? { itemCount: 0, sum: 0, oddCount: 0 };
  const span = Math.max(1, shard.to - shard.from);
  const sleeper = new Int32Array(new SharedArrayBuffer(4));
  let lastCheckpoint = Date.now();
  while (cursor < shard.to) {
    if ((shard.delayMsPerItem > 0 || (cursor & 1023) === 0) && ctx.shouldStop()) throw new CancelledError();
    if (shard.delayMsPerItem > 0) Atomics.wait(sleeper, 0, 0, shard.delayMsPerItem);
    const v = itemValue(cursor);
    partial.itemCount += 1;
    partial.sum += v;
    if (v % 2 === 1) partial.oddCount += 1;
    cursor += 1;
    // Reading the clock per item would cost more than the item itself when there is no delay.
    if (shard.delayMsPerItem > 0 || (cursor & 1023) === 0) {
      const fraction = (cursor - shard.from) / span;
      ctx.onProgress(fraction, "counting");
      if (Date.now() - lastCheckpoint >= CHECKPOINT_EVERY_MS) {
        lastCheckpoint = Date.now();
        ctx.checkpoint(fraction, "counting", cursor, { ...partial });
      }
    }
  }
  return partial;
});
