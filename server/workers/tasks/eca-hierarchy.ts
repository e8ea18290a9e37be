// Thin wrapper: one shard of the elementary-rule block-emulation hierarchy, resumable from a unit cursor; the
// checkpoint carries every unit result so far, so a resumed shard never searches a unit twice.
import { runHierarchyShard, type HierarchyPart } from "@shared/engine/block-emulation";
import { runTask } from "../task-context";
import type { ShardTaskInput } from "../task-protocol";

export interface EcaHierarchyShard {
  maxBlock: number;
  shardIndex: number;
  shardCount: number;
}
export interface EcaHierarchyPartial {
  part: HierarchyPart;
  computeMs: number;
}

const CHECKPOINT_EVERY_MS = 500;

export default function ecaHierarchyTask(task: ShardTaskInput) {
  return runTask(task, (ctx) => {
    const shard = task.input as EcaHierarchyShard;
    const previous = task.partial as EcaHierarchyPartial | null;
    const units = [...(previous?.part.units ?? [])];
    const started = performance.now();
    const spent = () => (previous?.computeMs ?? 0) + performance.now() - started;
    let fraction = 0;
    let lastCheckpoint = Date.now();
    runHierarchyShard({
      ...shard,
      cursor: typeof task.cursor === "number" ? task.cursor : 0,
      shouldStop: ctx.shouldStop,
      onProgress: (f, phase) => {
        fraction = f;
        ctx.onProgress(f, phase);
      },
      onUnit: (result, cursor) => {
        units.push(result);
        if (Date.now() - lastCheckpoint < CHECKPOINT_EVERY_MS) return;
        lastCheckpoint = Date.now();
        ctx.checkpoint(fraction, "searching", cursor, {
          part: { maxBlock: shard.maxBlock, units: [...units] },
          computeMs: spent(),
        });
      },
    });
    return { part: { maxBlock: shard.maxBlock, units }, computeMs: spent() } satisfies EcaHierarchyPartial;
  });
}
