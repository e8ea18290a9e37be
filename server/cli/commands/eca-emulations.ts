// `eca-emulations --rule F --block k [--time t] [--json]`: every elementary rule that F emulates at block size k and
// time t (default k), one witness each, targets ascending, codewords leftmost cell first.
import { EngineError } from "../../../shared/engine/errors";
import { ecaRule } from "../../../shared/engine/automata";
import { blockEmulations, MAX_SEARCH_BLOCK } from "../../../shared/engine/block-emulation";

export const summary = "elementary rules emulated by --rule F at --block k [--time t] [--json]";

const USAGE = "usage: eca-emulations --rule F (0..255) --block k (1..20) [--time t (1..k)] [--json]";

/** Reads `--name value` options; returns an error message for anything it does not know. */
function parseOptions(args: string[], valued: string[], flags: string[]): { values: Map<string, string>; flags: Set<string> } | string {
  const values = new Map<string, string>();
  const seen = new Set<string>();
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    if (flags.includes(a)) seen.add(a);
    else if (valued.includes(a)) {
      const v = args[i + 1];
      if (v === undefined || v.startsWith("--")) return `${a} needs a value`;
      if (values.has(a)) return `${a} is given twice`;
      values.set(a, v);
      i++;
    } else return `unknown argument "${a}"`;
  }
  return { values, flags: seen };
}

function parseInteger(text: string | undefined, name: string, lo: number, hi: number): number | string {
  if (text === undefined) return `${name} is required`;
  if (!/^\d+$/.test(text)) return `${name} must be an integer ${lo}..${hi}, got "${text}"`;
  const n = Number(text);
  if (n < lo || n > hi) return `${name} must be an integer ${lo}..${hi}, got ${n}`;
  return n;
}

export async function run(args: string[]): Promise<number> {
  const fail = (msg: string) => {
    process.stderr.write(`eca-emulations: ${msg}\n${USAGE}\n`);
    return 2;
  };
  const opts = parseOptions(args, ["--rule", "--block", "--time"], ["--json"]);
  if (typeof opts === "string") return fail(opts);
  const rule = parseInteger(opts.values.get("--rule"), "--rule", 0, 255);
  if (typeof rule === "string") return fail(rule);
  const block = parseInteger(opts.values.get("--block"), "--block", 1, MAX_SEARCH_BLOCK);
  if (typeof block === "string") return fail(block);
  const time = opts.values.has("--time") ? parseInteger(opts.values.get("--time"), "--time", 1, block) : block;
  if (typeof time === "string") return fail(time);
  let result;
  try {
    result = blockEmulations(ecaRule(rule), block, time);
  } catch (err) {
    if (err instanceof EngineError) return fail(err.message);
    throw err;
  }
  if (opts.flags.has("--json")) {
    const out = {
      rule,
      block,
      time,
      emulations: result.emulations.map((e) => ({ target: e.target, encoding: { "0": e.u0, "1": e.u1 } })),
    };
    process.stdout.write(JSON.stringify(out) + "\n");
  } else {
    const lines = [`rule ${rule}, block ${block}, time ${time}: ${result.emulations.length} emulated rule(s)`];
    for (const e of result.emulations) lines.push(`  ${String(e.target).padStart(3)}  0 -> ${e.u0}  1 -> ${e.u1}`);
    process.stdout.write(lines.join("\n") + "\n");
  }
  return 0;
}
