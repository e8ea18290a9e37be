// Thin wrapper: merges the shards' unit results and assembles the hierarchy (closure, composed witnesses checked
// by the independent verifier) in a pool thread, since assembly of large block sizes takes a while.
import { assembleEcaHierarchy, mergeHierarchyParts } from "@shared/engine/block-emulation";
import { EngineError } from "@shared/engine/errors";
import { HierarchyRunParameters } from "@shared/schemas/automata";
import { EcaHierarchyPartial } from "@shared/schemas/run-tasks";
import { runResultFromEngine } from "../../services/automata/eca-hierarchy-compute";
import { mergeTask } from "../task-context";

export default mergeTask({ params: HierarchyRunParameters, partial: EcaHierarchyPartial }, (partials, params) => {
  const started = performance.now();
  const hierarchy = assembleEcaHierarchy(mergeHierarchyParts(partials.map((p) => p.part)));
  if (hierarchy.maxBlock !== params.maxBlock)
    throw new EngineError(
      "BAD_PARTS",
      `shards computed block size ${hierarchy.maxBlock}, the run asked for ${params.maxBlock}`,
    );
  const computeMs = partials.reduce((s, p) => s + p.computeMs, 0) + performance.now() - started;
  return runResultFromEngine(hierarchy, computeMs);
});
