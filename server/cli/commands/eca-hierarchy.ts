// `eca-hierarchy --max-block K [--json]`: the block-emulation relation among the 256 elementary rules for block
// sizes 1..K (each pair with its least block size) and the rules that emulate nothing with 2 <= k <= K.
import { ecaHierarchy, MAX_HIERARCHY_BLOCK } from "@shared/engine/block-emulation";
import { integerOption, parseCommandArgs, printJson, runCommand } from "../cli-io";

export const summary = "block-emulation hierarchy of the 256 elementary rules up to --max-block K [--json]";

const USAGE = `usage: eca-hierarchy --max-block K (1..${MAX_HIERARCHY_BLOCK}) [--json]`;

export function run(args: string[]): Promise<number> {
  return runCommand("eca-hierarchy", USAGE, async () => {
    const { values } = parseCommandArgs(args, { "max-block": { type: "string" }, json: { type: "boolean" } }, 0);
    const maxBlock = integerOption(values["max-block"], "--max-block", 1, MAX_HIERARCHY_BLOCK);
    const h = ecaHierarchy(maxBlock);
    if (values.json) {
      const out = {
        maxBlock,
        relations: h.relations.map((r) => ({ source: r.source, target: r.target, minBlock: r.minBlock })),
        emulateNothing: h.emulateNothing,
      };
      printJson(out);
    } else {
      const byBlock = new Map<number, number>();
      for (const r of h.relations) byBlock.set(r.minBlock, (byBlock.get(r.minBlock) ?? 0) + 1);
      const lines = [
        `block-emulation hierarchy of the elementary rules, block sizes 1..${maxBlock}`,
        `  ${h.relations.length} related pairs (${[...byBlock]
          .sort((a, b) => a[0] - b[0])
          .map(([k, n]) => `k=${k}: ${n}`)
          .join(", ")})`,
        `  ${h.composed.length} further pairs only through composition`,
        `  ${h.mutualClasses.length} classes of mutually emulating rules, ${h.reduction.length} edges in the transitive reduction`,
        `  emulate nothing with 2 <= k <= ${maxBlock}: ${h.emulateNothing.join(" ") || "none"}`,
      ];
      process.stdout.write(lines.join("\n") + "\n");
    }
    return 0;
  });
}
