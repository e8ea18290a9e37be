export {
  CERTIFICATE_FORMAT,
  CERTIFICATE_VERSION,
  networkToCertificate,
  networkFromCertificate,
  blockEmulationCertificate,
  embeddingCertificate,
  coarseGrainingCertificate,
  type ReductionNotion,
  type ReductionCertificate,
  type CertificateNetwork,
  type CertificateNode,
  type CertificateBlock,
  type CertificateObservable,
  type CertificateCone,
  type BlockEmulationWitnessJson,
  type EmbeddingWitnessJson,
  type CoarseGrainingWitnessJson,
} from "./certificate-format";
export {
  verifyCertificate,
  MAX_VERIFIED_SOURCE_NODES,
  MAX_CERTIFICATE_TIME,
  MAX_CHECK_WORK,
  type VerificationReport,
} from "./verify-certificate";
export { composeCertificates } from "./compose-certificates";
