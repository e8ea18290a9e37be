// Perturbations as a view of the model: a knocked-out node is held at 0, an over-expressed node at 1, and a fixed
// input condition holds an input node at a chosen value; the node's function becomes that constant, the usual
// in-silico mutant construction (e.g. Li et al., "The yeast cell-cycle network is robustly designed", PNAS 2004).
import { EngineError } from "../errors";
import { checkNetwork, type BooleanNetwork } from "../network";

export interface Perturbation {
  knockOut?: readonly number[];
  overExpress?: readonly number[];
  /** Input conditions: node index -> value held. Only nodes without regulators or regulated only by themselves. */
  fixedInputs?: ReadonlyMap<number, 0 | 1> | Readonly<Record<number, 0 | 1>>;
}

/** The network with each perturbed node's function replaced by a constant; names and node order are kept. */
export function perturbNetwork(net: BooleanNetwork, perturbation: Perturbation): BooleanNetwork {
  const n = net.names.length;
  const held = new Map<number, 0 | 1>();
  const hold = (node: number, value: 0 | 1, what: string) => {
    if (!Number.isInteger(node) || node < 0 || node >= n)
      throw new EngineError("BAD_PERTURBATION", `${what}: node index ${node} is out of range`);
    const before = held.get(node);
    if (before !== undefined && before !== value)
      throw new EngineError("BAD_PERTURBATION", `node "${net.names[node]}" is held at both 0 and 1`);
    held.set(node, value);
  };
  for (const node of perturbation.knockOut ?? []) hold(node, 0, "knock-out");
  for (const node of perturbation.overExpress ?? []) hold(node, 1, "over-expression");
  const inputs = perturbation.fixedInputs;
  const entries: [number, 0 | 1][] =
    inputs instanceof Map
      ? [...inputs.entries()]
      : Object.entries(inputs ?? {}).map(([k, v]) => [Number(k), v as 0 | 1]);
  for (const [node, value] of entries) {
    const regs = net.regulators[node];
    if (regs && !Array.from(regs).every((r) => r === node)) {
      throw new EngineError(
        "BAD_PERTURBATION",
        `node "${net.names[node]}" is not an input (it has regulators other than itself)`,
      );
    }
    hold(node, value, "fixed input");
  }
  return checkNetwork({
    names: net.names,
    regulators: net.regulators.map((r, i) => (held.has(i) ? new Int32Array(0) : r)),
    tables: net.tables.map((t, i) => (held.has(i) ? Uint8Array.of(held.get(i)!) : t)),
  });
}
