// Sizes the reduction searches and certificate checks accept, written once: the tabulating notions (dynamical
// embedding, coarse-graining) hold every source state in typed arrays, and the verifier re-simulates every target
// state within a request. The tabulating limit is the engine's own, re-exported here under the server's name.
import { MAX_TABULATED_NODES } from "@shared/engine/emulation";

/** Largest sources the tabulating notions accept (2^22 states); block emulation has no such bound. */
export const MAX_TABULATED_SOURCE_NODES = MAX_TABULATED_NODES;
/** Largest targets a search looks for or an uploaded certificate may name. */
export const MAX_TARGET_NODES = 12;
