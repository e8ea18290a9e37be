export type { MiddleBlockMap } from "./middle-block-map";
export { MAX_SEARCH_BLOCK, middleBlockMap, checkBlockParameters } from "./middle-block-map";
export type { Emulation, BlockEmulationResult, BlockSearchOptions } from "./block-emulations";
export { blockEmulations } from "./block-emulations";
export type { PackedEmulation } from "./affine-emulations";
export { affineEmulations } from "./affine-emulations";
export type { EmulationCheck } from "./verify-emulation";
export { verifyEmulation } from "./verify-emulation";
export type { CodewordPair } from "./compose-emulations";
export { composeWitnesses } from "./compose-emulations";
export type { NaiveResult, NaiveMinBlocks } from "./naive-emulations";
export { naiveEmulations, naiveEcaMinBlocks } from "./naive-emulations";
export type {
  HierarchyUnit,
  HierarchyUnitResult,
  HierarchyPart,
  ShardOptions,
  ShardRun,
  HierarchyRelation,
  ComposedRelation,
  HierarchyEdge,
  EcaHierarchy,
  AssembleOptions,
} from "./eca-hierarchy";
export {
  MAX_HIERARCHY_BLOCK,
  SPLIT_FROM_BLOCK,
  HIERARCHY_SHARDS,
  hierarchyUnits,
  shardUnits,
  runHierarchyShard,
  mergeHierarchyParts,
  assembleEcaHierarchy,
  ecaHierarchy,
} from "./eca-hierarchy";
export type { EmulationDiagrams } from "./emulation-diagrams";
export { emulationDiagrams, encodeConfiguration } from "./emulation-diagrams";
export type { HierarchySelfCheck } from "./hierarchy-self-check";
export { checkHierarchyAgainstSmaller } from "./hierarchy-self-check";
