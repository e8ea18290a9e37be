// `verify <certificate.json>`: re-checks a reduction certificate by plain simulation with the independent verifier.
// Exit 0 only for a valid certificate; 1 when it is invalid or unreadable; 2 for usage errors.
import { verifyCertificate } from "@shared/engine/certificates";
import { CommandError, parseCommandArgs, readTextFile, runCommand, UsageError } from "../cli-io";

export const summary = "verify <certificate.json> [--json]: re-check a reduction certificate (exit 0 only when valid)";
const USAGE = "usage: verify <certificate.json> [--json]";

export function run(args: string[]): Promise<number> {
  return runCommand("verify", USAGE, async () => {
    const { values, positionals } = parseCommandArgs(args, { json: { type: "boolean" } }, 1);
    if (positionals.length === 0) throw new UsageError("the certificate file is missing");
    const text = await readTextFile(positionals[0]!);
    let certificate: unknown;
    try {
      certificate = JSON.parse(text);
    } catch (err) {
      throw new CommandError(`${positionals[0]}: not JSON (${(err as Error).message})`);
    }
    const report = verifyCertificate(certificate);
    if (values.json) process.stdout.write(JSON.stringify(report) + "\n");
    else if (report.valid && (report.notion === "node-elimination" || report.notion === "constant-percolation"))
      process.stdout.write(
        `valid ${report.notion} certificate: ${report.statesChecked} truth-table rows re-derived and compared\n`,
      );
    else if (report.valid)
      process.stdout.write(
        `valid ${report.notion} certificate, time scale ${report.time}: ${report.statesChecked} states re-simulated\n`,
      );
    else process.stdout.write(`INVALID certificate:\n${report.problems.map((p) => `  - ${p}`).join("\n")}\n`);
    return report.valid ? 0 : 1;
  });
}
