// Thin wrapper: merges the shards' unit results and assembles the hierarchy (closure, composed witnesses checked
// by the independent verifier) in a pool thread, since assembly of large block sizes takes a while.
import { assembleEcaHierarchy, mergeHierarchyParts } from "@shared/engine/block-emulation";
import { EngineError } from "@shared/engine/errors";
import type { HierarchyRunParameters } from "@shared/schemas/automata";
import { runResultFromEngine } from "../../automata/eca-hierarchy-compute";
import type { MergeTaskInput } from "../../jobs/run-kind";
import type { EcaHierarchyPartial } from "./eca-hierarchy";

export default function ecaHierarchyMergeTask(input: MergeTaskInput) {
  try {
    const started = performance.now();
    const partials = input.partials as EcaHierarchyPartial[];
    const params = input.params as HierarchyRunParameters;
    const hierarchy = assembleEcaHierarchy(mergeHierarchyParts(partials.map((p) => p.part)));
    if (hierarchy.maxBlock !== params.maxBlock)
      throw new EngineError(
        "BAD_PARTS",
        `shards computed block size ${hierarchy.maxBlock}, the run asked for ${params.maxBlock}`,
      );
    const computeMs = partials.reduce((s, p) => s + p.computeMs, 0) + performance.now() - started;
    return { ok: true as const, result: runResultFromEngine(hierarchy, computeMs) };
  } catch (err) {
    if (err instanceof EngineError) return { ok: false as const, error: { code: err.code, message: err.message } };
    throw err;
  }
}
