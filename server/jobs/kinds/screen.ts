// "screen": a perturbation screen of the run's revision, split into contiguous ranges of its units (see
// shared/engine/screens), merged and ranked as one unsplit screen would be.
import { checkScreenSpec, mergeScreenShards, screenUnitCount } from "@shared/engine/screens";
import { EngineError } from "@shared/engine/errors";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { screenTask, type ScreenTaskShard, type TrapSpaceCount } from "@shared/schemas/run-tasks";
import { ScreenParams, type ScreenRunResult } from "@shared/schemas/screens";
import { RunRequestError } from "../run-errors";
import { defineRunKind, taskFile } from "../run-kind";

/** Units per shard: enough that a shard's own baseline analyses stay a small part of its work. */
const UNITS_PER_SHARD = 12;
const MAX_SHARDS = 16;

export const screenKind = defineRunKind({
  kind: "screen",
  params: ScreenParams,
  task: { ...screenTask, file: taskFile("screen") },
  timeLimitSeconds: 3 * 3600,
  plan(p, revision) {
    if (!revision) throw new RunRequestError(400, "INVALID_INPUT", "A screen needs a model revision");
    const spec = { nodes: p.nodes, pairs: p.pairs, phenotype: p.phenotype };
    try {
      checkScreenSpec(compileDefinition(readRuleText(revision.ruleText)), spec);
    } catch (err) {
      if (err instanceof EngineError) throw new RunRequestError(400, "UNKNOWN_NODE", `params: ${err.message}`);
      throw err;
    }
    const units = screenUnitCount(spec);
    const shardCount = Math.max(1, Math.min(MAX_SHARDS, Math.ceil(units / UNITS_PER_SHARD)));
    return Array.from({ length: shardCount }, (_, i): ScreenTaskShard => ({
      ruleText: revision.ruleText,
      ...spec,
      update: p.update,
      range: { start: Math.floor((i * units) / shardCount), end: Math.floor(((i + 1) * units) / shardCount) },
    }));
  },
  merge(partials, p): ScreenRunResult {
    const merged = mergeScreenShards(partials.map((q) => q.shard));
    const traps = new Map<number, TrapSpaceCount>();
    for (const q of partials) q.shard.rows.forEach((row, k) => q.trapSpaces && traps.set(row.unit, q.trapSpaces[k]!));
    return {
      ...merged,
      update: p.update,
      baselineTrapSpaces: partials[0]?.baselineTrapSpaces ?? null,
      rows: merged.rows.map((row) => ({ ...row, trapSpaces: traps.get(row.unit) ?? null })),
    };
  },
});
