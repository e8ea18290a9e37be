// `screen <model file> --nodes A,B,C [--pairs] --phenotype "X=1,Y=0" [--json]`: every single knock-out and
// over-expression of the chosen nodes (and every pair of them with --pairs), ranked by the share of states whose
// synchronous attractor has the phenotype. Above 24 nodes rows come from fixed points by SAT, with basinShare null.
import { parseAssignment, parseNodeList, type TextIssue } from "@shared/engine/expectations";
import { runScreen } from "@shared/engine/screens";
import { UsageError, parseCommandArgs, printJson, readModel, runCommand } from "../cli-io";

export const summary =
  'screen <model file> --nodes A,B [--pairs] --phenotype "X=1,Y=0" [--json]: perturbations ranked by phenotype basin';

const USAGE =
  'usage: screen <model file (.sbml, .xml, .rules, .txt, .csv)> --nodes A,B,C [--pairs] --phenotype "X=1,Y=0" [--json]';

function optionIssue(option: string, text: string, issue: TextIssue): UsageError {
  return new UsageError(`${option} "${text}", at character ${issue.offset + 1}: ${issue.message}`);
}

export function run(args: string[]): Promise<number> {
  return runCommand("screen", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(
      args,
      {
        nodes: { type: "string" },
        pairs: { type: "boolean" },
        phenotype: { type: "string" },
        json: { type: "boolean" },
      },
      1,
    );
    if (values.nodes === undefined) throw new UsageError("--nodes is required");
    if (values.phenotype === undefined) throw new UsageError("--phenotype is required");
    const nodes = parseNodeList(values.nodes);
    if (nodes.issues[0]) throw optionIssue("--nodes", values.nodes, nodes.issues[0]);
    if (nodes.nodes.length === 0) throw new UsageError("--nodes names no node");
    const phenotype = parseAssignment(values.phenotype);
    if (phenotype.issues[0]) throw optionIssue("--phenotype", values.phenotype, phenotype.issues[0]);
    const model = await readModel(positionals[0]);
    for (const w of model.warnings) process.stderr.write(`screen: warning: ${w}\n`);
    const result = runScreen(model.network, {
      nodes: nodes.nodes,
      pairs: values.pairs ?? false,
      phenotype: phenotype.assignment,
    });
    if (values.json) {
      printJson(result);
      return 0;
    }
    const what = result.counted === "attractors" ? "attractors" : "fixed points";
    const share = (x: number | null) => (x === null ? "     -" : `${(100 * x).toFixed(1).padStart(5)}%`);
    const label = (p: Record<string, 0 | 1>) =>
      Object.entries(p)
        .map(([name, v]) => `${name} ${v ? "over-expressed" : "knocked out"}`)
        .join(", ");
    const lines = [
      `${model.network.names.length} nodes, ${result.rows.length} perturbation(s), method ${result.method}; phenotype ${Object.entries(
        result.phenotype,
      )
        .map(([k, v]) => `${k}=${v}`)
        .join(" ")}`,
      `unperturbed: ${result.baseline.attractors} ${what}, ${result.baseline.phenotypeAttractors} with the phenotype, basin share ${share(result.baseline.basinShare).trim()}`,
      "",
      `  share  ${what.padEnd(12)} lost gained  perturbation`,
      ...result.rows.map(
        (r) =>
          `${share(r.basinShare)}  ${`${r.phenotypeAttractorsAfter}/${r.attractorsAfter}`.padEnd(12)} ${String(r.attractorsLost).padStart(4)} ${String(r.attractorsGained).padStart(6)}  ${label(r.perturbation)}`,
      ),
    ];
    process.stdout.write(lines.join("\n") + "\n");
    return 0;
  });
}
