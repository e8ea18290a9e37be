// Random threshold networks: each node sums K randomly chosen regulators with weights +1 or -1 (equally likely) and
// switches on above the offset, off below it, and keeps or drops its value on a tie, as in the weighted-sum
// cell-cycle models of Li, Long, Lu, Ouyang, Tang, "The yeast cell-cycle network is robustly designed", PNAS 2004.
import { EngineError } from "../errors";
import type { ModelDefinition } from "../rules";
import { sampleDistinct } from "./nk-network";

export interface ThresholdNetworkOptions {
  readonly n: number;
  /** Regulators per node (distinct, chosen uniformly among all nodes). */
  readonly k: number;
  readonly offset?: number;
  readonly tie?: "keep" | "zero";
  readonly random: () => number;
}

/** A random threshold model as rules (compile it with compileDefinition; print it with printRuleText). */
export function thresholdNetwork({ n, k, offset = 0, tie = "keep", random }: ThresholdNetworkOptions): ModelDefinition {
  if (!Number.isInteger(n) || n < 1) throw new EngineError("BAD_ARGUMENT", `N must be a positive integer, got ${n}`);
  if (!Number.isInteger(k) || k < 0 || k > n)
    throw new EngineError("BAD_ARGUMENT", `K must be an integer from 0 to N = ${n}, got ${k}`);
  if (k + (tie === "keep" ? 1 : 0) > 20)
    throw new EngineError("BAD_ARGUMENT", `K = ${k} gives more than the 20 regulators a node may have`);
  if (!Number.isSafeInteger(offset)) throw new EngineError("BAD_ARGUMENT", `offset must be an integer, got ${offset}`);
  const names = Array.from({ length: n }, (_, i) => `x${i}`);
  return {
    nodes: names.map((name) => ({
      name,
      rule: {
        kind: "threshold" as const,
        terms: sampleDistinct(n, k, random).map((r) => ({ weight: random() < 0.5 ? -1 : 1, node: names[r]! })),
        offset,
        tie,
      },
    })),
  };
}
