export { perturbNetwork } from "./perturb-network";
export type { Perturbation } from "./perturb-network";
export { compareAttractors } from "./compare-attractors";
export type { AttractorLike, AttractorComparison } from "./compare-attractors";
