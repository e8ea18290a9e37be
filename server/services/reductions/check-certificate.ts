// A certificate checked by the independent verifier, as the stored record a reviewer reads: valid or not, why,
// when and by whom (null when the server checked it on its own, e.g. when a search found it).
import { verifyCertificate } from "@shared/engine/certificates";
import type { Verification } from "@shared/schemas/reductions";

export function checkCertificate(
  certificate: unknown,
  checkedBy: Verification["checkedBy"],
  occasion = "",
): Verification {
  const report = verifyCertificate(certificate);
  return {
    isValid: report.valid,
    message: report.valid
      ? `valid: ${report.statesChecked} states re-simulated${occasion}`
      : report.problems.join("; "),
    checkedAt: new Date().toISOString(),
    checkedBy,
  };
}
