// `eca-hierarchy --max-block K [--json]`: the block-emulation relation among the 256 elementary rules for block
// sizes 1..K (each pair with its least block size) and the rules that emulate nothing with 2 <= k <= K.
import { EngineError } from "../../../shared/engine/errors";
import { ecaHierarchy, MAX_HIERARCHY_BLOCK } from "../../../shared/engine/block-emulation";

export const summary = "block-emulation hierarchy of the 256 elementary rules up to --max-block K [--json]";

const USAGE = `usage: eca-hierarchy --max-block K (1..${MAX_HIERARCHY_BLOCK}) [--json]`;

export async function run(args: string[]): Promise<number> {
  const fail = (msg: string) => {
    process.stderr.write(`eca-hierarchy: ${msg}\n${USAGE}\n`);
    return 2;
  };
  let maxText: string | undefined;
  let json = false;
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    if (a === "--json") json = true;
    else if (a === "--max-block") {
      if (maxText !== undefined) return fail("--max-block is given twice");
      maxText = args[++i];
      if (maxText === undefined || maxText.startsWith("--")) return fail("--max-block needs a value");
    } else return fail(`unknown argument "${a}"`);
  }
  if (maxText === undefined) return fail("--max-block is required");
  if (!/^\d+$/.test(maxText) || Number(maxText) < 1 || Number(maxText) > MAX_HIERARCHY_BLOCK) {
    return fail(`--max-block must be an integer 1..${MAX_HIERARCHY_BLOCK}, got "${maxText}"`);
  }
  const maxBlock = Number(maxText);
  let h;
  try {
    h = ecaHierarchy(maxBlock);
  } catch (err) {
    if (err instanceof EngineError) return fail(err.message);
    throw err;
  }
  if (json) {
    const out = {
      maxBlock,
      relations: h.relations.map((r) => ({ source: r.source, target: r.target, minBlock: r.minBlock })),
      emulateNothing: h.emulateNothing,
    };
    process.stdout.write(JSON.stringify(out) + "\n");
  } else {
    const byBlock = new Map<number, number>();
    for (const r of h.relations) byBlock.set(r.minBlock, (byBlock.get(r.minBlock) ?? 0) + 1);
    const lines = [
      `block-emulation hierarchy of the elementary rules, block sizes 1..${maxBlock}`,
      `  ${h.relations.length} related pairs (${[...byBlock].sort((a, b) => a[0] - b[0]).map(([k, n]) => `k=${k}: ${n}`).join(", ")})`,
      `  ${h.composed.length} further pairs only through composition`,
      `  ${h.mutualClasses.length} classes of mutually emulating rules, ${h.reduction.length} edges in the transitive reduction`,
      `  emulate nothing with 2 <= k <= ${maxBlock}: ${h.emulateNothing.join(" ") || "none"}`,
    ];
    process.stdout.write(lines.join("\n") + "\n");
  }
  return 0;
}
