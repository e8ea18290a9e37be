// "eca-hierarchy": the block-emulation preorder of the 256 elementary rules up to a block size, split into shards
// of search units (see shared/engine/block-emulation). The result is a HierarchyRunResult; the automata routes
// file it in eca_hierarchies the first time someone asks for that hierarchy.
import { HIERARCHY_SHARDS, hierarchyUnits } from "@shared/engine/block-emulation";
import { HierarchyRunParameters } from "@shared/schemas/automata";
import { ecaHierarchyTask } from "@shared/schemas/run-tasks";
import { defineRunKind, taskFile } from "../run-kind";

export const ecaHierarchyKind = defineRunKind({
  kind: "eca-hierarchy",
  params: HierarchyRunParameters,
  task: { ...ecaHierarchyTask, file: taskFile("eca-hierarchy") },
  mergeTaskFile: taskFile("eca-hierarchy-merge"),
  timeLimitSeconds: 6 * 3600,
  plan(p) {
    const shardCount = Math.min(HIERARCHY_SHARDS, hierarchyUnits(p.maxBlock).length);
    return Array.from({ length: shardCount }, (_, shardIndex) => ({ maxBlock: p.maxBlock, shardIndex, shardCount }));
  },
  merge() {
    throw new Error("eca-hierarchy merges in a worker thread (mergeTaskFile)");
  },
});
