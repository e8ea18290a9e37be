// Sizes the reduction searches and certificate checks accept, written once: the tabulating notions (dynamical
// embedding, coarse-graining) hold every source state in typed arrays, and the verifier re-simulates every target
// state within a request. They are the engine's limits; when the engine exports them, these take its values.

/** Largest sources the tabulating notions accept (2^22 states); block emulation has no such bound. */
export const MAX_TABULATED_SOURCE_NODES = 22;
/** Largest targets a search looks for or an uploaded certificate may name. */
export const MAX_TARGET_NODES = 12;
