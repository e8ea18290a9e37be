// `coarse-grain <file> --observe A,B [--time t] --json`: do the observed nodes predict themselves t steps ahead? When they
// do, the certificate of the coarse-grained network; either way, for sources that can be tabulated, the size of the
// coarsest grouping of states that refines the observables and is compatible with the dynamics. Larger sources are
// decided by SAT: a closing answer carries the same certificate, a failing one two states the observed nodes cannot
// tell apart whose images differ on them.
import { coarseGrainingCertificate } from "@shared/engine/certificates";
import { coarseGrainBySat, MAX_SAT_COARSE_GRAINING_TIME, nodeObservable } from "@shared/engine/coarse-graining";
import { MAX_TABULATED_NODES } from "@shared/engine/emulation";
import type { BooleanNetwork } from "@shared/engine/network";
import { mergeShards, searchShard } from "../../services/reductions/search-plan";
import {
  CommandError,
  integerOption,
  parseCommandArgs,
  printJson,
  readModelFile,
  runCommand,
  UsageError,
} from "../cli-io";

export const summary = "coarse-grain <file> --observe A,B [--time t] --json: coarse-graining onto observed nodes";
const USAGE = `usage: coarse-grain <model file> --observe A,B,... [--time t (1..8, default 1)] [--json]
  sources above ${MAX_TABULATED_NODES} nodes are decided by SAT (t up to ${MAX_SAT_COARSE_GRAINING_TIME}, observed nodes only)`;

export function run(args: string[]): Promise<number> {
  return runCommand("coarse-grain", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(
      args,
      { observe: { type: "string" }, time: { type: "string" }, json: { type: "boolean" } },
      1,
    );
    const source = await readModelFile(positionals[0]);
    const observe = (values.observe ?? "")
      .split(",")
      .map((s) => s.trim())
      .filter(Boolean);
    if (observe.length === 0) throw new UsageError("--observe needs at least one node name");
    if (source.names.length > MAX_TABULATED_NODES)
      return bySat(
        source,
        observe,
        integerOption(values.time, "--time", 1, MAX_SAT_COARSE_GRAINING_TIME, 1),
        values.json,
      );
    const search = {
      mode: "coarse-grain" as const,
      sourceModelId: "",
      observe,
      time: integerOption(values.time, "--time", 1, 8, 1),
    };
    const result = mergeShards(source, null, search, [searchShard(source, null, search, { range: null }, {})]);
    const out = {
      closes: result.found,
      groups: result.groups,
      ...(result.found ? { witness: result.findings[0]!.certificate } : {}),
    };
    if (values.json) printJson(out);
    else
      process.stdout.write(
        result.found
          ? `the observables close: F coarse-grains onto a ${observe.length}-node network\n`
          : `the observables do not close; the coarsest compatible grouping has ${result.groups} groups\n`,
      );
    return 0;
  });
}

function bySat(source: BooleanNetwork, observe: string[], time: number, json: boolean | undefined): number {
  const observed = observe.map((name) => {
    const i = source.names.indexOf(name);
    if (i < 0) throw new CommandError(`there is no node named "${name}" in the source`);
    return i;
  });
  const r = coarseGrainBySat(source, observed, time);
  const out = r.closes
    ? {
        closes: true,
        method: "sat",
        witness: coarseGrainingCertificate(
          source,
          r.target!,
          time,
          observed.map((o) => nodeObservable(source, o)),
        ),
      }
    : { closes: false, method: "sat", counterexample: r.counterexample };
  if (json) printJson(out);
  else
    process.stdout.write(
      r.closes
        ? `the observables close (proved by SAT): F coarse-grains onto a ${observed.length}-node network\n`
        : `the observables do not close: two states agree on ${observe.join(", ")} but their images differ on ${r.counterexample!.differingNodes.join(", ")}\n`,
    );
  return 0;
}
