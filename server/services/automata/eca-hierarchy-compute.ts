// Turns the engine's hierarchy into the record the database stores: direct pairs with their minimal block size and
// witness, plus the closure's composed pairs whose composed witness the engine's verifier confirmed.
import { ecaHierarchy, type EcaHierarchy } from "@shared/engine/block-emulation";
import { HierarchyRunResult, type HierarchyPairWithWitness, type HierarchyParameters } from "@shared/schemas/automata";
import type { FinishedHierarchyRun, HierarchyRecord } from "../../db/repositories/eca-hierarchies";

export function hierarchyPairsFromEngine(h: EcaHierarchy): {
  pairs: HierarchyPairWithWitness[];
  unverifiedComposed: number;
} {
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
    pairs.push({
      source: c.source,
      target: c.target,
      minBlock: c.block,
      witness: { time: c.block, encoding: { "0": c.u0, "1": c.u1 }, via: c.via },
    });
  }
  pairs.sort((a, b) => a.source - b.source || a.target - b.target);
  return { pairs, unverifiedComposed };
}

/** Computes the hierarchy in this thread (meant for block sizes up to INLINE_MAX_BLOCK, a few seconds). */
export function computeHierarchyRecord(
  key: HierarchyParameters,
  opts: {
    computedBy: string | null;
    runId?: string | null;
    onProgress?: (fraction: number, phase: string) => void;
    shouldStop?: () => boolean;
  },
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

/** What a background run hands over: the engine's hierarchy, restated as the pairs this table stores. */
export function runResultFromEngine(h: EcaHierarchy, computeMs: number): HierarchyRunResult {
  return {
    maxBlock: h.maxBlock,
    timeMode: "block",
    radius: 1,
    pairs: hierarchyPairsFromEngine(h).pairs,
    emulateNothing: h.emulateNothing,
    computeMs,
  };
}

/** The record to store from a finished run, or null when its result is not a hierarchy for these parameters. */
export function recordFromRun(run: FinishedHierarchyRun, key: HierarchyParameters): HierarchyRecord | null {
  const parsed = HierarchyRunResult.safeParse(run.result);
  if (!parsed.success) return null;
  const result = parsed.data;
  if (result.maxBlock !== key.maxBlock || result.timeMode !== key.timeMode || result.radius !== key.radius) return null;
  return {
    maxBlock: result.maxBlock,
    timeMode: result.timeMode,
    radius: result.radius,
    pairs: result.pairs,
    emulateNothing: result.emulateNothing,
    // the wall time of the whole run (queueing excluded) is what the user waited; the summed compute time is kept
    // when the run did not report its start
    durationMs: run.wallMs ?? result.computeMs,
    computedBy: run.startedBy,
    runId: run.id,
  };
}
