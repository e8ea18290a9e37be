export { tableFormula } from "./function-formula";
export { satCycles, satFixedPoints } from "./synchronous-cycles";
export type { SatCycle, SatCycleSearch, SatOptions } from "./synchronous-cycles";
