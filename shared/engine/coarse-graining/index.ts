export { nodeObservable, observeAll, type Observable } from "./observables";
export { coarsestCompatiblePartition, type StatePartition } from "./coarsest-partition";
export {
  coarseGrain,
  coarseGrainsOnto,
  type CoarseGrainingResult,
  type CoarseGrainingControl,
} from "./coarse-graining";
export {
  coarseGrainBySat,
  MAX_SAT_COARSE_GRAINING_NODES,
  MAX_SAT_COARSE_GRAINING_TIME,
  MAX_SAT_OBSERVED_NODES,
  type SatCoarseGrainingResult,
  type ClosureCounterexample,
} from "./sat-coarse-graining";
