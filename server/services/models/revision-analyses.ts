// The analyses of one stored revision that are small enough to answer within a request: exact synchronous attractors
// (cached per revision, or taken from a finished "attractors" run), knock-out comparisons, trajectories and the
// structure view. Larger state spaces are refused with NEEDS_RUN, naming the run kind that computes them.
import type { Knex } from "knex";
import seedrandom from "seedrandom";
import { EngineError } from "@shared/engine/errors";
import { compileDefinition } from "@shared/engine/rules";
import { bytesFromString, bytesToString, trajectory } from "@shared/engine/update";
import type { z } from "zod";
import {
  INLINE_ANALYSIS_MAX_NODES,
  type PerturbationBody,
  type PerturbationResult,
  type StructureResult,
  type SynchronousResult,
  type TrajectoryBody,
  type TrajectoryResult,
} from "@shared/schemas/models";
import { AttractorsResult } from "@shared/schemas/run-tasks";
import {
  findAnalysis,
  findAttractorRunResult,
  storeAnalysis,
  type StoredRevision,
} from "../../db/repositories/model-revisions";
import { HttpError } from "../../http/errors";
import { perturbedNetwork } from "./perturbed-network";
import { structureView } from "./structure-view";
import { synchronousAttractors, withPhenotypes } from "./synchronous-view";

type CachedSynchronous = Omit<SynchronousResult, "markers">;

function requireInlineSize(stored: StoredRevision): void {
  if (stored.nodeCount > INLINE_ANALYSIS_MAX_NODES) {
    throw new HttpError(
      409,
      "NEEDS_RUN",
      `This model has ${stored.nodeCount} nodes; the exact synchronous analysis of more than ${INLINE_ANALYSIS_MAX_NODES} nodes runs as a background run (kind "attractors")`,
      { kind: "attractors", nodeCount: stored.nodeCount, revisionId: stored.id },
    );
  }
}

/** An "attractors" run result (server/workers/tasks/attractors.ts) in the shape this API answers with. */
function fromAttractorRun(result: unknown): CachedSynchronous | null {
  const parsed = AttractorsResult.safeParse(result);
  if (!parsed.success) return null;
  const r = parsed.data;
  return {
    nodes: r.nodeNames,
    stateCount: r.stateCount,
    maxTransient: r.maxTransient,
    meanTransient: r.meanTransient,
    attractors: r.attractors.map((a) => ({ ...a, phenotype: null })),
  };
}

async function synchronousOf(db: Knex, stored: StoredRevision): Promise<CachedSynchronous> {
  const cached = await findAnalysis<CachedSynchronous>(db, stored.id, "synchronous");
  if (cached) return cached;
  const fromRun = fromAttractorRun(await findAttractorRunResult(db, stored.id));
  if (fromRun) {
    await storeAnalysis(db, stored.id, "synchronous", fromRun);
    return fromRun;
  }
  requireInlineSize(stored);
  const result = synchronousAttractors(compileDefinition(stored.definition));
  await storeAnalysis(db, stored.id, "synchronous", result);
  return result;
}

/** Every synchronous attractor with its basin, labelled by the marker nodes' pattern. */
export async function revisionAttractors(
  db: Knex,
  stored: StoredRevision,
  markers: readonly string[],
): Promise<SynchronousResult> {
  return withPhenotypes(await synchronousOf(db, stored), markers);
}

/** Attractors before and after a perturbation, with the basin each phenotype holds in both. */
export async function comparePerturbation(
  db: Knex,
  stored: StoredRevision,
  perturbation: z.output<typeof PerturbationBody>,
): Promise<PerturbationResult> {
  requireInlineSize(stored);
  const view = perturbedNetwork(compileDefinition(stored.definition), perturbation);
  const before = withPhenotypes(await synchronousOf(db, stored), perturbation.markers);
  const after = withPhenotypes(synchronousAttractors(view), perturbation.markers);
  const phenotypes = new Map<string, { basinBefore: number; basinAfter: number }>();
  const tally = (result: SynchronousResult, key: "basinBefore" | "basinAfter") => {
    for (const a of result.attractors) {
      const label = a.phenotype ?? "";
      const entry = phenotypes.get(label) ?? { basinBefore: 0, basinAfter: 0 };
      entry[key] += a.basin;
      phenotypes.set(label, entry);
    }
  };
  tally(before, "basinBefore");
  tally(after, "basinAfter");
  return {
    before,
    after,
    phenotypes: [...phenotypes]
      .map(([phenotype, v]) => ({ phenotype, ...v }))
      .sort((a, b) => b.basinBefore - a.basinBefore || a.phenotype.localeCompare(b.phenotype)),
  };
}

/** States one trajectory answer may hold (nodes × (steps + 1)): about 2 MB of JSON, checked before any work. */
export const TRAJECTORY_MAX_CELLS = 2_000_000;

export function checkTrajectorySize(stored: StoredRevision, request: z.output<typeof TrajectoryBody>): void {
  const cells = stored.nodeCount * (request.steps + 1);
  if (cells > TRAJECTORY_MAX_CELLS)
    throw new HttpError(
      422,
      "LIMIT_EXCEEDED",
      `A trajectory may hold at most ${TRAJECTORY_MAX_CELLS.toLocaleString("en")} node values (nodes × (steps + 1)); ` +
        `this model has ${stored.nodeCount} nodes, so ask for at most ${Math.max(0, Math.floor(TRAJECTORY_MAX_CELLS / stored.nodeCount) - 1)} steps`,
      { limit: "trajectoryCells", max: TRAJECTORY_MAX_CELLS, value: cells },
    );
}

/** One trajectory from a given state; the asynchronous schemes draw from a generator seeded with `seed`. */
export function revisionTrajectory(stored: StoredRevision, request: z.output<typeof TrajectoryBody>): TrajectoryResult {
  const net = compileDefinition(stored.definition);
  if (request.initial.length !== net.names.length) {
    throw new HttpError(
      400,
      "INVALID_INPUT",
      `The initial state has ${request.initial.length} values but the model has ${net.names.length} nodes`,
    );
  }
  const rng = request.scheme === "synchronous" ? undefined : seedrandom(String(request.seed));
  let rows: Uint8Array[];
  try {
    rows = trajectory(net, bytesFromString(request.initial), { scheme: request.scheme, steps: request.steps, rng });
  } catch (e) {
    if (e instanceof EngineError) throw new HttpError(400, "INVALID_INPUT", e.message);
    throw e;
  }
  return {
    nodes: [...net.names],
    scheme: request.scheme,
    seed: rng ? request.seed : null,
    states: rows.map(bytesToString),
  };
}

export function revisionStructure(stored: StoredRevision): StructureResult {
  return structureView(stored.definition, compileDefinition(stored.definition), stored.network.inputs);
}
