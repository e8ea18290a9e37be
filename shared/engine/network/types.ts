// The compiled Boolean network: the one representation every analysis in the engine works on.
// Conventions (used everywhere, never re-derived):
// - a state of n nodes is an integer index whose bit i is the value of node i (node 0 is the least significant bit);
// - a node's truth table row is sum_j x[regulators[j]] << j, so bit j of the row is the value of its j-th regulator;
// - as text, a state is written as n characters '0'/'1' in node order (character i is node i).

export interface BooleanNetwork {
  /** Node names in model order. */
  readonly names: readonly string[];
  /** regulators[i]: indices of the inputs of node i, in the order that defines its truth-table rows. */
  readonly regulators: readonly Int32Array[];
  /** tables[i][row] is 0 or 1; length 2^regulators[i].length. */
  readonly tables: readonly Uint8Array[];
}
