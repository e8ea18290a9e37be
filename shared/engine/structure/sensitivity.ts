// Average sensitivity: the expected number of inputs whose flip changes a node's output, over uniformly random
// input rows; the network value is the mean over nodes (Shmulevich and Kauffman, "Activities and sensitivities in
// Boolean network models", Physical Review Letters 2004). Random functions of K inputs with output bias p have
// expected average sensitivity 2p(1-p)K; a value of 1 marks the critical regime.
import type { BooleanNetwork } from "../network";

/** Average sensitivity of one truth table (row bit j = input j), inputs uniform. */
export function tableSensitivity(table: Uint8Array): number {
  const k = Math.log2(table.length);
  let flips = 0;
  for (let row = 0; row < table.length; row++)
    for (let j = 0; j < k; j++) if (table[row] !== table[row ^ (1 << j)]) flips++;
  return flips / table.length;
}

export function nodeSensitivities(net: BooleanNetwork): Float64Array {
  return Float64Array.from(net.tables, tableSensitivity);
}

export function networkSensitivity(net: BooleanNetwork): number {
  const s = nodeSensitivities(net);
  return s.length === 0 ? 0 : s.reduce((a, b) => a + b, 0) / s.length;
}
