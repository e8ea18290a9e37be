export { attractorStatistics } from "./attractor-statistics";
export type { AttractorStatistics, EnsembleMember } from "./attractor-statistics";
export { derridaCurve, annealedDamage } from "./derrida-curve";
export type { DerridaPoint, DerridaOptions } from "./derrida-curve";
