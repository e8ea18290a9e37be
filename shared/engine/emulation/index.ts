export {
  stepValues,
  iterateValues,
  successorTable,
  powerTable,
  transitionTable,
  MAX_TABULATED_NODES,
} from "./network-step";
export { networkFromSuccessors, successorsOfNetwork } from "./network-from-successors";
export {
  encodeTargetState,
  checkWitnessShape,
  witnessHolds,
  type BlockEmulationWitness,
  type EmulationBlock,
} from "./block-witness";
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
export {
  canonicalTargetKey,
  relabelledTables,
  trivialityFlags,
  interactionCount,
  type TargetFlag,
} from "./canonical-target";
export {
  discoverShard,
  mergeDiscoverShards,
  discoverEmulatedTargets,
  discoverUnitCount,
  type DiscoverBounds,
  type DiscoveredTarget,
  type DiscoverShardResult,
  type DiscoverResult,
} from "./discover-targets";
export { randomNetwork, plantEmulation, type Rng, type PlantedEmulation } from "./planted-reductions";
export { cycleLengthCounts, cyclesFit } from "./cycle-prefilter";
export {
  enumerateEncodings,
  enumerationUnitCount,
  MAX_ENUMERATED_NODES,
  type EnumerationBounds,
  type FoundEncoding,
  type EnumerationRun,
} from "./encoding-enumeration";
