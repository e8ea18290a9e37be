// A certificate checked by the independent verifier, as the stored record a reviewer reads: valid or not, why,
// when and by whom (null when the server checked it on its own, e.g. when a search found it).
// Re-simulation grows with the source network, so the request thread hands it to the interactive pool.
import { verifyCertificate } from "@shared/engine/certificates";
import type { Verification } from "@shared/schemas/reductions";
import { offThread } from "../../workers/interactive-pool";

function verification(
  report: ReturnType<typeof verifyCertificate>,
  checkedBy: Verification["checkedBy"],
  occasion: string,
): Verification {
  return {
    isValid: report.valid,
    message: report.valid ? `valid: ${checkedWhat(report)}${occasion}` : report.problems.join("; "),
    checkedAt: new Date().toISOString(),
    checkedBy,
  };
}

function checkedWhat(report: ReturnType<typeof verifyCertificate>): string {
  if (report.notion === "node-elimination" || report.notion === "constant-percolation")
    return `${report.statesChecked} truth-table rows of the reduced functions re-derived and compared`;
  if (!report.cones) return `${report.statesChecked} states re-simulated`;
  const bySat = report.cones.filter((c) => c.method === "sat").length;
  const byTable = report.cones.length - bySat;
  return `each observed node's update checked on its cone (${[
    byTable ? `${byTable} by truth table, ${report.statesChecked} assignments` : "",
    bySat ? `${bySat} by SAT` : "",
  ]
    .filter(Boolean)
    .join("; ")})`;
}

/** In the calling thread: for worker tasks and merges, which run off the request thread already. */
export function checkCertificate(
  certificate: unknown,
  checkedBy: Verification["checkedBy"],
  occasion = "",
): Verification {
  return verification(verifyCertificate(certificate), checkedBy, occasion);
}

/** For requests: the verifier runs in the interactive pool under its time and memory limits. */
export async function checkCertificateOffThread(
  certificate: unknown,
  checkedBy: Verification["checkedBy"],
  occasion = "",
): Promise<Verification> {
  return verification(await offThread("verifyCertificate", certificate), checkedBy, occasion);
}
