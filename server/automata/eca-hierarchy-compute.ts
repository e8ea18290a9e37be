// Turns the engine's hierarchy into the record the database stores: direct pairs with their minimal block size and
// witness, plus the closure's composed pairs whose composed witness the engine's verifier confirmed.
import { ecaHierarchy, type EcaHierarchy } from "../../shared/engine/block-emulation";
import type { HierarchyPairWithWitness, HierarchyParameters, HierarchyRunResult } from "../../shared/schemas/automata";
import type { HierarchyRecord } from "../db/repositories/eca-hierarchies";

export function hierarchyPairsFromEngine(h: EcaHierarchy): { pairs: HierarchyPairWithWitness[]; unverifiedComposed: number } {
  const pairs: HierarchyPairWithWitness[] = h.relations.map((r) => ({
    source: r.source,
    target: r.target,
    minBlock: r.minBlock,
    witness: { time: r.minBlock, encoding: { "0": r.u0, "1": r.u1 } },
  }));
  let unverifiedComposed = 0;
  for (const c of h.composed) {
    // a composed witness that the verifier did not confirm is not evidence; it is left out rather than stored
    if (c.verified !== true) {
      unverifiedComposed++;
      continue;
    }
    pairs.push({ source: c.source, target: c.target, minBlock: c.block, witness: { time: c.block, encoding: { "0": c.u0, "1": c.u1 }, via: c.via } });
  }
  pairs.sort((a, b) => a.source - b.source || a.target - b.target);
  return { pairs, unverifiedComposed };
}

/** Computes the hierarchy in this thread (meant for block sizes up to INLINE_MAX_BLOCK, a few seconds). */
export function computeHierarchyRecord(
  key: HierarchyParameters,
  opts: { computedBy: string | null; runId?: string | null; onProgress?: (fraction: number, phase: string) => void; shouldStop?: () => boolean },
): HierarchyRecord {
  const started = performance.now();
  const h = ecaHierarchy(key.maxBlock, { onProgress: opts.onProgress, shouldStop: opts.shouldStop });
  const { pairs } = hierarchyPairsFromEngine(h);
  return {
    maxBlock: key.maxBlock,
    timeMode: key.timeMode,
    radius: key.radius,
    pairs,
    emulateNothing: h.emulateNothing,
    durationMs: performance.now() - started,
    computedBy: opts.computedBy,
    runId: opts.runId ?? null,
  };
}

/** The result a background run hands over, for the same storage. */
export function recordFromRunResult(result: HierarchyRunResult, opts: { computedBy: string | null; runId: string }): HierarchyRecord {
  return {
    maxBlock: result.maxBlock,
    timeMode: result.timeMode,
    radius: result.radius,
    pairs: result.pairs,
    emulateNothing: result.emulateNothing,
    durationMs: result.computeMs,
    computedBy: opts.computedBy,
    runId: opts.runId,
  };
}
