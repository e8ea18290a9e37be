export { nodeObservable, observeAll, type Observable } from "./observables";
export { coarsestCompatiblePartition, type StatePartition } from "./coarsest-partition";
export {
  coarseGrain,
  coarseGrainsOnto,
  type CoarseGrainingResult,
  type CoarseGrainingControl,
} from "./coarse-graining";
