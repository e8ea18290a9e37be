export { tableFormula } from "./function-formula";
export { satCycles, satFixedPoints } from "./synchronous-cycles";
export type { SatCycle, SatCycleSearch, SatOptions } from "./synchronous-cycles";
export { ClauseSolver } from "./clause-solver";
export { tableCubes } from "./table-cubes";
export { requireNodeFunction, requireFixedPoint, forEachFixedPoint } from "./fixed-point-clauses";
