export { nodeValue, synchronousStep, bytesFromString, bytesToString } from "./node-value";
export { successorTable, MAX_TABLE_NODES } from "./successor-table";
export type { LongTaskOptions } from "./successor-table";
export { trajectory } from "./trajectory";
export type { UpdateScheme, TrajectoryOptions } from "./trajectory";
