export type {
  Assignment,
  UpdateKind,
  ExpectationCondition,
  CountComparison,
  ExpectedOutcome,
  OutcomeKind,
  Expectation,
} from "./expectation";
export { OUTCOME_KINDS, NO_CONDITION, sameAssignment } from "./expectation";
export {
  parseAssignment,
  parseNodeList,
  formatAssignment,
  resolveAssignment,
  stateMatches,
  type TextIssue,
  type NodePattern,
} from "./assignment";
export {
  readingOfStates,
  readingOfIndices,
  isFixedPointReading,
  MAX_LISTED_STATES,
  type CensusScope,
  type CensusAttractor,
  type AttractorCensus,
  type AttractorMethod,
  type UndecidedReason,
} from "./attractor-census";
export {
  METHOD,
  exactSynchronousMethod,
  exactAsynchronousMethod,
  trajectoryMethod,
  satCyclesMethod,
  satFixedPointsMethod,
} from "./census-methods";
export { trapSpaceMethod, TRAP_SPACE_METHOD } from "./trap-space-method";
export { judgeOutcome, describeAttractor, type ExpectationStatus, type Judgement } from "./judge-outcome";
export {
  evaluateExpectations,
  evaluateExpectation,
  groupByCondition,
  attractorMethods,
  EVALUATION_DEFAULTS,
  type EvaluationOptions,
  type ExpectationResult,
} from "./evaluate-expectations";
export {
  parseExpectationsCsv,
  readExpectationsCsv,
  writeExpectationsCsv,
  CSV_COLUMNS,
  MAX_CSV_ERRORS,
  type ExpectationsCsvResult,
} from "./expectations-csv";
