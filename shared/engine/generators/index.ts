export { cellularAutomaton } from "./cellular-automaton";
export type { CellularAutomatonOptions } from "./cellular-automaton";
export { nkNetwork, sampleDistinct } from "./nk-network";
export type { NkOptions } from "./nk-network";
export { thresholdNetwork } from "./threshold-network";
export type { ThresholdNetworkOptions } from "./threshold-network";
