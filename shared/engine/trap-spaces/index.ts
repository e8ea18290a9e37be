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
export {
  asynchronousAttractorReport,
  MAX_ATTRACTOR_REPORT_NODES,
  MAX_EXACT_FREE_NODES,
  MAX_LISTED_ATTRACTOR_STATES,
  DEFAULT_ATTRACTOR_TRAP_SPACE_LIMIT,
  type AsynchronousAttractorReport,
  type AttractorReportOptions,
  type AttractorMethod,
  type LocatedAttractor,
  type MinimalTrapSpaceReport,
  type TrapSpaceVerdict,
} from "./trap-space-attractors";
