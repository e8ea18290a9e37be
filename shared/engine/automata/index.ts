export type { RuleTable } from "./rule-table";
export {
  MAX_RADIUS,
  isEcaNumber,
  ecaRule,
  ruleFromNumber,
  ruleFromTable,
  ruleNumber,
  ecaNumber,
  isAffineRule,
} from "./rule-table";
export {
  reflectRule,
  complementRule,
  reflectEca,
  complementEca,
  ecaSymmetryImages,
  ecaSymmetryClasses,
} from "./rule-symmetry";
export { stepWord, stepRing, stepPackedWord } from "./step-cells";
export {
  MAX_PACKED_CELLS,
  packedToString,
  packedFromString,
  cellsFromString,
  cellsToString,
  reverseString,
  complementString,
} from "./packed-words";
export type { SpaceTimeDiagram } from "./space-time-diagram";
export { spaceTimeDiagram } from "./space-time-diagram";
