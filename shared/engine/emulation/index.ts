export { stepValues, iterateValues, successorTable, powerTable, transitionTable, MAX_TABULATED_NODES } from "./network-step";
export { networkFromSuccessors, successorsOfNetwork } from "./network-from-successors";
export { encodeTargetState, checkWitnessShape, witnessHolds, type BlockEmulationWitness, type EmulationBlock } from "./block-witness";
export { EmulationSatInstance, type EmulationSatProblem } from "./emulation-sat";
export { shardRange, type UnitRange } from "./search-units";
export {
  searchBlockEmulation,
  mergeEmulationShards,
  emulationUnitCount,
  type EmulationBounds,
  type EmulationSearchResult,
  type SearchControl,
} from "./given-target-search";
export { canonicalTargetKey, trivialityFlags, interactionCount, type TargetFlag } from "./canonical-target";
export {
  discoverShard,
  mergeDiscoverShards,
  discoverEmulatedTargets,
  discoverUnitCount,
  MAX_DISCOVER_NODES,
  type DiscoverBounds,
  type DiscoveredTarget,
  type DiscoverShardResult,
  type DiscoverResult,
} from "./discover-targets";
export { randomNetwork, plantEmulation, type Rng, type PlantedEmulation } from "./planted-reductions";
