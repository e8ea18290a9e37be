export {
  eliminateNodes,
  eligibleNodes,
  MAX_ELIMINATION_REGULATORS,
  MAX_ELIMINATION_NODES,
  ELIMINATION_PRESERVES,
  type EliminationOptions,
  type EliminationResult,
} from "./eliminate-nodes";
export { percolateConstants, MAX_PERCOLATION_NODES, type PercolationResult } from "./percolate-constants";
