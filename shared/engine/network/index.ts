export type { BooleanNetwork } from "./types";
export { networkFromFunctions, checkNetwork, stateToString, stateFromString } from "./build";
