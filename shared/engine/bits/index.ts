export { transpose32 } from "./transpose32";
export { reverseBits, compareStateIndices, rotateToSmallest } from "./state-order";
