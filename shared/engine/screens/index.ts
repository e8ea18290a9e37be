export {
  screenUnits,
  screenUnit,
  screenUnitCount,
  checkScreenSpec,
  type ScreenSpec,
  type ScreenUnit,
} from "./screen-units";
export {
  compareRows,
  MAX_LISTED_FIXED_POINTS,
  type ScreenRow,
  type ScreenBaseline,
  type ScreenMethod,
} from "./screen-row";
export {
  screenRange,
  mergeScreenShards,
  runScreen,
  screenMethod,
  type UnitRange,
  type ScreenControl,
  type ScreenShard,
  type ScreenResult,
} from "./run-screen";
export { trapSpacePhenotypeCount, type TrapSpaceCount } from "./trap-space-count";
