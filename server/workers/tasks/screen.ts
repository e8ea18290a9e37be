// Thin wrapper: one range of a screen's units. Rows are checkpointed as they come, so a resumed shard starts at the
// first unit it has no row for; under asynchronous update each row also counts minimal trap spaces.
import { screenRange, screenUnit, trapSpacePhenotypeCount } from "@shared/engine/screens";
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { screenTask, type ScreenTaskPartial } from "@shared/schemas/run-tasks";
import { shardTask } from "../task-context";

export default shardTask(screenTask, ({ input, cursor, partial }, ctx): ScreenTaskPartial => {
  const network = compileDefinition(readRuleText(input.ruleText));
  const spec = { nodes: input.nodes, pairs: input.pairs, phenotype: input.phenotype };
  const asynchronous = input.update === "asynchronous";
  const { start: first, end } = input.range;
  const resumed = partial && cursor !== null ? partial : null;
  const start = resumed ? cursor! : first;
  const stop = { shouldStop: ctx.shouldStop };
  const rows = [...(resumed?.shard.rows ?? [])];
  const traps = [...(resumed?.trapSpaces ?? [])];
  const baselineTrapSpaces = asynchronous
    ? (resumed?.baselineTrapSpaces ?? trapSpacePhenotypeCount(network, {}, input.phenotype, stop))
    : null;
  const span = Math.max(1, end - first);
  // A checkpoint must carry the shard's baseline, which the engine computes before the first row: an empty range
  // gives it (the same for every range of this screen) at the cost of one more analysis of the unperturbed model.
  const header = resumed?.shard ?? screenRange(network, spec, { start, end: start }, stop);
  const rest = screenRange(
    network,
    spec,
    { start, end },
    {
      ...stop,
      onProgress: (f, phase) => ctx.onProgress((start - first + f * (end - start)) / span, phase),
      onRow(row) {
        rows.push(row);
        if (asynchronous)
          traps.push(trapSpacePhenotypeCount(network, screenUnit(spec, row.unit).perturbation, input.phenotype, stop));
        const next = row.unit + 1;
        ctx.checkpoint((next - first) / span, "perturbations", next, {
          shard: { ...header, range: { start: first, end: next }, rows: [...rows] },
          trapSpaces: asynchronous ? [...traps] : null,
          baselineTrapSpaces,
        });
      },
    },
  );
  return {
    shard: { ...rest, range: input.range, rows },
    trapSpaces: asynchronous ? traps : null,
    baselineTrapSpaces,
  };
});
