// A certificate found elsewhere (the command line, another installation) enters review like a search result, but
// only if it verifies and its source is exactly the model's latest revision (and its target, when one is named,
// exactly that model's latest revision). Networks are compared as structures, so key order in the upload is free.
import { isDeepStrictEqual } from "node:util";
import type { Knex } from "knex";
import { networkToCertificate } from "@shared/engine/certificates";
import type { Certificate, ReductionDetail } from "@shared/schemas/reductions";
import { recordAudit } from "../../db/repositories/audit-log";
import { HttpError } from "../../http/errors";
import { checkCertificateOffThread } from "./check-certificate";
import { proposeReduction } from "./propose-reduction";
import { latestRevisionNetwork, type RevisionNetwork } from "./revision-network";
import { reductionOf, type ReductionActor } from "./review";
import { MAX_TARGET_NODES } from "./search-limits";
import { isSelfReduction, statementFlags } from "./statement-flags";

export interface CertificateUpload {
  sourceModelId: string;
  targetModelId?: string;
  certificate: Certificate;
}

const isNetworkOf = (stored: RevisionNetwork, sent: Certificate["source"]) =>
  isDeepStrictEqual(networkToCertificate(stored.network), sent);

export async function uploadCertificate(
  db: Knex,
  by: ReductionActor,
  upload: CertificateUpload,
): Promise<{ reduction: ReductionDetail; isNew: boolean }> {
  const { certificate } = upload;
  // Verification re-simulates every target state within this request; searches never produce larger targets.
  if (certificate.target.nodes.length > MAX_TARGET_NODES) {
    throw new HttpError(
      400,
      "TOO_LARGE",
      `certificate.target: it has ${certificate.target.nodes.length} nodes; targets have at most ${MAX_TARGET_NODES}`,
      [{ field: "body.certificate.target.nodes", message: `at most ${MAX_TARGET_NODES} nodes` }],
    );
  }
  if (upload.targetModelId === upload.sourceModelId || isSelfReduction(certificate)) {
    throw new HttpError(
      400,
      "SELF_REDUCTION",
      "certificate.target: it is the source network itself (F = G); a model reduced onto itself proves nothing",
      [{ field: "body.targetModelId", message: "the target must differ from the source" }],
    );
  }
  const source = await latestRevisionNetwork(db, by.projectId, upload.sourceModelId, "sourceModelId");
  if (!isNetworkOf(source, certificate.source)) {
    throw new HttpError(
      400,
      "SOURCE_MISMATCH",
      `certificate.source: it is not the network of "${source.modelName}" revision ${source.revision}`,
    );
  }
  let targetRevisionId: string | null = null;
  if (upload.targetModelId) {
    const target = await latestRevisionNetwork(db, by.projectId, upload.targetModelId, "targetModelId");
    if (!isNetworkOf(target, certificate.target)) {
      throw new HttpError(
        400,
        "TARGET_MISMATCH",
        `certificate.target: it is not the network of "${target.modelName}" revision ${target.revision}`,
      );
    }
    targetRevisionId = target.revisionId;
  }
  const verification = await checkCertificateOffThread(certificate, by.user);
  if (!verification.isValid)
    throw new HttpError(400, "INVALID_CERTIFICATE", `The certificate does not verify: ${verification.message}`);
  const stored = await db.transaction(async (trx) => {
    const r = await proposeReduction(
      trx,
      {
        projectId: by.projectId,
        sourceRevisionId: source.revisionId,
        targetRevisionId,
        certificate,
        flags: statementFlags(certificate, []),
        foundBy: by.user.id,
        foundInRunId: null,
      },
      () => verification,
    );
    if (r.isNew) {
      await recordAudit(trx, {
        projectId: by.projectId,
        actorId: by.user.id,
        action: "reduction.upload",
        target: r.id,
        details: { notion: certificate.notion },
      });
    }
    return r;
  });
  return { reduction: await reductionOf(db, by.projectId, stored.id), isNew: stored.isNew };
}
