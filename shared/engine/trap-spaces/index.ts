export {
  trapSpaces,
  forEachTrapSpace,
  MAX_TRAP_SPACE_NODES,
  DEFAULT_TRAP_SPACE_LIMIT,
  type TrapSpace,
  type TrapSpaceKind,
  type TrapSpaceSearch,
  type TrapSpaceOptions,
} from "./trap-spaces";
export {
  FREE,
  percolate,
  constantOnSubspace,
  restrictToSubspace,
  essentialPart,
  readersOf,
  subspacePattern,
  fixedByName,
  type RestrictedNetwork,
} from "./subspace";
