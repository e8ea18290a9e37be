// Thin wrapper: one shard of the elementary-rule block-emulation hierarchy, resumable from a unit cursor; the
// checkpoint carries every unit result so far, so a resumed shard never searches a unit twice.
import { runHierarchyShard } from "@shared/engine/block-emulation";
import { ecaHierarchyTask, type EcaHierarchyPartial } from "@shared/schemas/run-tasks";
import { shardTask } from "../task-context";

const CHECKPOINT_EVERY_MS = 500;

export default shardTask(ecaHierarchyTask, ({ input: shard, cursor, partial: previous }, ctx) => {
  const units = [...(previous?.part.units ?? [])];
  const started = performance.now();
  const spent = () => (previous?.computeMs ?? 0) + performance.now() - started;
  let fraction = 0;
  let lastCheckpoint = Date.now();
  runHierarchyShard({
    ...shard,
    cursor: cursor ?? 0,
    shouldStop: ctx.shouldStop,
    onProgress: (f, phase) => {
      fraction = f;
      ctx.onProgress(f, phase);
    },
    onUnit: (result, next) => {
      units.push(result);
      if (Date.now() - lastCheckpoint < CHECKPOINT_EVERY_MS) return;
      lastCheckpoint = Date.now();
      ctx.checkpoint(fraction, "searching", next, {
        part: { maxBlock: shard.maxBlock, units: [...units] },
        computeMs: spent(),
      });
    },
  });
  return { part: { maxBlock: shard.maxBlock, units }, computeMs: spent() } satisfies EcaHierarchyPartial;
});
