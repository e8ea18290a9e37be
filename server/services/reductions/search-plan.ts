// A reduction search as a sharded run: how the bounds become shards, what one shard computes (in a worker thread),
// and how shard results merge into findings with certificates. Shard results cross the database as JSON, so
// networks travel in certificate form and witnesses as plain arrays.
import {
  blockEmulationCertificate,
  coarseGrainingCertificate,
  embeddingCertificate,
  networkFromCertificate,
  networkToCertificate,
} from "@shared/engine/certificates";
import { coarseGrain, coarseGrainBySat, nodeObservable } from "@shared/engine/coarse-graining";
import {
  discoverShard,
  discoverUnitCount,
  emulationUnitCount,
  MAX_TABULATED_NODES,
  mergeDiscoverShards,
  mergeEmulationShards,
  searchBlockEmulation,
  shardRange,
  type SearchControl,
} from "@shared/engine/emulation";
import { searchDynamicalEmbedding } from "@shared/engine/embedding";
import { EngineError } from "@shared/engine/errors";
import type { BooleanNetwork } from "@shared/engine/network";
import { compileDefinition, networkToDefinition, printRuleText, readRuleText } from "@shared/engine/rules";
import type {
  ReductionSearchParams,
  ReductionSearchResult,
  SearchBody,
  SearchFinding,
} from "@shared/schemas/reductions";
import type { ReductionSearchPartial, SearchShard } from "@shared/schemas/run-tasks";
import { statementFlags } from "./statement-flags";

/** A non-closing coarse-graining lists its groups' dynamics up to this many groups, and its network up to 2^12. */
export const MAX_LISTED_GROUPS = 64;
const MAX_QUOTIENT_GROUPS = 4096;

/**
 * Discover keeps this many best-ranked targets on the run as its findings list (a person may propose any of them);
 * the rest are only counted. Which of them enter review at once is decided when they are stored (store-findings.ts).
 */
export const MAX_DISCOVER_FINDINGS = 200;
const MAX_SHARDS = 8;

export function compileRuleText(ruleText: string): BooleanNetwork {
  return compileDefinition(readRuleText(ruleText));
}

function emulationBounds(s: SearchBody) {
  if (s.mode === "coarse-grain") throw new EngineError("BAD_BOUNDS", "coarse-graining has no block bounds");
  return {
    maxTime: s.maxTime ?? (s.mode === "discover" ? 1 : 3),
    maxBlock: s.maxBlock ?? (s.mode === "discover" ? 2 : 3),
    contextAllowed: s.allowContext ?? true,
    ...(s.mode === "discover" ? { maxTargetNodes: s.maxTargetNodes ?? 2 } : {}),
  };
}

/** Shards of a search: contiguous ranges of the engine's search units, or one shard for the unsplittable notions. */
export function planSearch(p: ReductionSearchParams): SearchShard[] {
  const s = p.search;
  if (s.mode === "coarse-grain" || (s.mode === "given-target" && s.notion === "dynamical-embedding"))
    return [{ range: null }];
  const source = compileRuleText(p.sourceRuleText);
  const bounds = emulationBounds(s);
  const total =
    s.mode === "discover"
      ? discoverUnitCount(source, { ...bounds, maxTargetNodes: s.maxTargetNodes ?? 2 })
      : emulationUnitCount(source, bounds);
  const count = Math.max(1, Math.min(MAX_SHARDS, Math.ceil(total / 64)));
  return Array.from({ length: count }, (_, i) => ({ range: shardRange(total, i, count) }));
}

/** One shard's work. `resumeFrom` continues an interrupted shard: every unit before it is known to hold nothing. */
export function runSearchShard(
  p: ReductionSearchParams,
  shard: SearchShard,
  control: SearchControl,
): ReductionSearchPartial {
  const target = p.targetRuleText ? compileRuleText(p.targetRuleText) : null;
  return searchShard(compileRuleText(p.sourceRuleText), target, p.search, shard, control);
}

/** The same on compiled networks (the command line reads any model format). */
export function searchShard(
  source: BooleanNetwork,
  target: BooleanNetwork | null,
  s: SearchBody,
  shard: SearchShard,
  control: SearchControl,
): ReductionSearchPartial {
  if (s.mode === "coarse-grain") {
    const observed = s.observe.map((name) => {
      const i = source.names.indexOf(name);
      if (i < 0) throw new EngineError("BAD_OBSERVABLE", `observe: "${name}" is not a node of the source model`);
      return i;
    });
    const observables = observed.map((i) => nodeObservable(source, i));
    const time = s.time ?? 1;
    if (source.names.length > MAX_TABULATED_NODES) return coarseGrainLargeSource(source, observed, time, control);
    const r = coarseGrain(source, observables, time, control);
    const certificate =
      r.closes && r.target
        ? (coarseGrainingCertificate(source, r.target, time, observables) as SearchFinding["certificate"])
        : null;
    const listed = r.groups <= MAX_LISTED_GROUPS;
    const coarsest = r.closes
      ? null
      : {
          groups: r.groups,
          observe: [...s.observe],
          succ: listed ? Array.from(r.groupSucc) : null,
          label: listed ? Array.from(r.groupLabel) : null,
          ruleText: r.groups <= MAX_QUOTIENT_GROUPS ? printRuleText(networkToDefinition(r.quotient)) : null,
        };
    return {
      mode: "coarse-grain",
      certificate,
      groups: r.groups,
      closes: r.closes,
      coarsest,
      method: "states",
      counterexample: null,
      coneNodes: null,
    };
  }
  if (s.mode === "given-target") {
    if (!target) throw new EngineError("BAD_TARGET", "a given-target search needs a target model");
    if (s.notion === "dynamical-embedding") {
      const r = searchDynamicalEmbedding(source, target, s.maxTime ?? 3, control);
      return { mode: "embedding", time: r.time, map: r.map ? Array.from(r.map) : null };
    }
    return {
      mode: "given-target",
      emulation: searchBlockEmulation(source, target, emulationBounds(s), {
        ...control,
        range: shard.range ?? undefined,
      }),
    };
  }
  const result = discoverShard(
    source,
    { ...emulationBounds(s), maxTargetNodes: s.maxTargetNodes ?? 2 },
    { ...control, range: shard.range ?? undefined },
  );
  return {
    mode: "discover",
    shard: {
      ...result,
      targets: result.targets.map((t) => ({ ...t, target: networkToCertificate(t.target), flags: [...t.flags] })),
    },
  };
}

/**
 * Sources too large to tabulate: closure decided by SAT on the cone of the observed nodes. The answer is a
 * certificate checked cone by cone, or two states the observed nodes cannot tell apart; no grouping is computed.
 */
function coarseGrainLargeSource(
  source: BooleanNetwork,
  observed: number[],
  time: number,
  control: SearchControl,
): ReductionSearchPartial {
  const r = coarseGrainBySat(source, observed, time, control);
  const certificate =
    r.closes && r.target
      ? (coarseGrainingCertificate(
          source,
          r.target,
          time,
          observed.map((i) => nodeObservable(source, i)),
        ) as SearchFinding["certificate"])
      : null;
  const counterexample = r.counterexample
    ? {
        nodes: [...source.names],
        observe: r.observed,
        states: r.counterexample.states,
        images: r.counterexample.images,
        differingNodes: r.counterexample.differingNodes,
      }
    : null;
  return {
    mode: "coarse-grain",
    certificate,
    groups: null,
    closes: r.closes,
    coarsest: null,
    method: "sat",
    counterexample,
    coneNodes: r.coneNodes,
  };
}

/** Merge shard results (in shard order) into the run's result: findings with self-contained certificates. */
export function mergeSearch(p: ReductionSearchParams, partials: ReductionSearchPartial[]): ReductionSearchResult {
  const target = p.targetRuleText ? compileRuleText(p.targetRuleText) : null;
  return mergeShards(compileRuleText(p.sourceRuleText), target, p.search, partials);
}

/** The same on compiled networks. */
export function mergeShards(
  source: BooleanNetwork,
  target: BooleanNetwork | null,
  s: SearchBody,
  partials: ReductionSearchPartial[],
): ReductionSearchResult {
  const r = mergeShardsUnflagged(source, target, s, partials);
  return { ...r, findings: r.findings.map((f) => ({ ...f, flags: statementFlags(f.certificate, f.flags) })) };
}

function mergeShardsUnflagged(
  source: BooleanNetwork,
  target: BooleanNetwork | null,
  s: SearchBody,
  partials: ReductionSearchPartial[],
): ReductionSearchResult {
  const base = {
    bounds: { ...s },
    reductionIds: [] as string[],
    heldBack: { notListed: 0, flagged: 0, beyondLimit: 0 },
    coarsest: null,
    method: "states" as const,
    counterexample: null,
    coneNodes: null,
  };
  const first = partials[0];
  if (!first) throw new EngineError("BAD_SHARD", "no shard results to merge");
  if (first.mode === "coarse-grain") {
    const findings = first.certificate
      ? [{ certificate: first.certificate, flags: [] as string[], rank: 0, reductionId: null }]
      : [];
    return {
      ...base,
      mode: "coarse-grain",
      found: findings.length > 0,
      findings,
      distinctTargets: findings.length,
      groups: first.groups,
      coarsest: first.coarsest ?? null,
      method: first.method,
      counterexample: first.counterexample,
      coneNodes: first.coneNodes,
    };
  }
  if (first.mode === "embedding") {
    const findings =
      first.map && target
        ? [
            {
              certificate: embeddingCertificate(source, target, first.time, first.map) as SearchFinding["certificate"],
              flags: [] as string[],
              rank: 0,
              reductionId: null,
            },
          ]
        : [];
    return {
      ...base,
      mode: "given-target",
      found: findings.length > 0,
      findings,
      distinctTargets: findings.length,
      groups: null,
    };
  }
  if (first.mode === "given-target") {
    const merged = mergeEmulationShards(partials.flatMap((x) => (x.mode === "given-target" ? [x.emulation] : [])));
    const findings =
      merged.found && merged.witness && target
        ? [
            {
              certificate: blockEmulationCertificate(source, target, merged.witness) as SearchFinding["certificate"],
              flags: [] as string[],
              rank: 0,
              reductionId: null,
            },
          ]
        : [];
    return {
      ...base,
      mode: "given-target",
      found: findings.length > 0,
      findings,
      distinctTargets: findings.length,
      groups: null,
    };
  }
  const merged = mergeDiscoverShards(
    partials.flatMap((x) =>
      x.mode === "discover"
        ? [{ ...x.shard, targets: x.shard.targets.map((t) => ({ ...t, target: networkFromCertificate(t.target) })) }]
        : [],
    ),
  );
  const findings = merged.targets.slice(0, MAX_DISCOVER_FINDINGS).map((t, rank) => ({
    certificate: blockEmulationCertificate(source, t.target, t.witness) as SearchFinding["certificate"],
    flags: t.trivial ? [...t.flags, "trivial"] : [...t.flags],
    rank,
    reductionId: null,
  }));
  return {
    ...base,
    mode: "discover",
    found: findings.length > 0,
    findings,
    distinctTargets: merged.targets.length,
    groups: null,
  };
}
