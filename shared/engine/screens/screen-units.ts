// A perturbation screen as a fixed list of numbered units (one perturbation each), so it can run as shards: every
// single knock-out and over-expression of the chosen nodes, then, on request, each pair of them on two different
// nodes. The order never changes, so rows of any split merge into what one unsplit run gives.
import { EngineError } from "../errors";
import type { Assignment } from "../expectations";
import type { BooleanNetwork } from "../network";

export interface ScreenSpec {
  /** The nodes to perturb, by name, in the order their units are listed. */
  readonly nodes: readonly string[];
  /** Also screen every pair of single perturbations on two different nodes. */
  readonly pairs: boolean;
  /** The phenotype ranked by: a partial assignment such as { X: 1, Y: 0 }. */
  readonly phenotype: Assignment;
  /** Largest model screened by exact synchronous basins (default 24); above it, fixed points by SAT. */
  readonly exactMaxNodes?: number;
}

export interface ScreenUnit {
  readonly index: number;
  /** Node name -> 0 (knocked out) or 1 (over-expressed). */
  readonly perturbation: Assignment;
}

/** Number of units: 2 per node, and 4 per pair of nodes when pairs are asked for. */
export function screenUnitCount(spec: ScreenSpec): number {
  const m = spec.nodes.length;
  return 2 * m + (spec.pairs ? 2 * m * (m - 1) : 0);
}

/** Check the spec against the network: known, distinct nodes and a non-empty phenotype on known nodes. */
export function checkScreenSpec(net: BooleanNetwork, spec: ScreenSpec): void {
  const names = new Set(net.names);
  if (spec.nodes.length === 0) throw new EngineError("BAD_SCREEN", "choose at least one node to perturb");
  const seen = new Set<string>();
  for (const node of spec.nodes) {
    if (!names.has(node)) throw new EngineError("BAD_SCREEN", `node ${node} is not in this model`);
    if (seen.has(node)) throw new EngineError("BAD_SCREEN", `node ${node} is chosen twice`);
    seen.add(node);
  }
  const phenotypeNodes = Object.keys(spec.phenotype);
  if (phenotypeNodes.length === 0) throw new EngineError("BAD_SCREEN", "the phenotype names no node");
  for (const node of phenotypeNodes)
    if (!names.has(node)) throw new EngineError("BAD_SCREEN", `phenotype node ${node} is not in this model`);
}

/** The unit with this index, computed without listing the others. */
export function screenUnit(spec: ScreenSpec, index: number): ScreenUnit {
  const m = spec.nodes.length;
  if (!Number.isInteger(index) || index < 0 || index >= screenUnitCount(spec))
    throw new EngineError("BAD_SHARD", `unit ${index} is not in this screen of ${screenUnitCount(spec)} units`);
  if (index < 2 * m) return { index, perturbation: { [spec.nodes[index >> 1]!]: (index & 1) as 0 | 1 } };
  // Pairs (a, b) with a < b in the order chosen, each with values 00, 01, 10, 11.
  let rest = index - 2 * m;
  const values = rest & 3;
  rest >>= 2;
  let a = 0;
  while (rest >= m - 1 - a) {
    rest -= m - 1 - a;
    a++;
  }
  const b = a + 1 + rest;
  return {
    index,
    perturbation: { [spec.nodes[a]!]: (values >> 1) as 0 | 1, [spec.nodes[b]!]: (values & 1) as 0 | 1 },
  };
}

/** Every unit of the screen, in unit order. */
export function screenUnits(spec: ScreenSpec): ScreenUnit[] {
  return Array.from({ length: screenUnitCount(spec) }, (_, i) => screenUnit(spec, i));
}
