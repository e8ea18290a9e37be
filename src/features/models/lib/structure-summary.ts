// What the structure view shows of a model, named for people: feedback circuits with their signs (Thomas, d'Ari,
// "Biological Feedback", 1990), each node's average sensitivity (Shmulevich, Kauffman, PRL 2004), canalizing inputs
// (Kauffman 1974) and regulators listed in a rule that never change its value. Runs in a Web Worker, since circuit
// enumeration can grow fast with the wiring; the bounds below keep it finite and are reported.
import { compileDefinition, readRuleText } from "@shared/engine/rules";
import { canalizingInputs, feedbackCircuits, interactionGraph, nodeSensitivities } from "@shared/engine/structure";

export const MAX_CIRCUIT_LENGTH = 8;
export const MAX_CIRCUITS = 500;

export interface StructureSummary {
  nodes: string[];
  circuits: { nodes: string[]; sign: "positive" | "negative" | "dual" }[];
  /** False when the circuit list stopped at MAX_CIRCUITS. */
  circuitsComplete: boolean;
  sensitivity: { node: string; value: number }[];
  averageSensitivity: number;
  canalizing: { node: string; regulator: string; inputValue: 0 | 1; output: 0 | 1 }[];
  nonEssential: { node: string; regulator: string }[];
}

export function structureSummary(ruleText: string): StructureSummary {
  const net = compileDefinition(readRuleText(ruleText));
  const names = [...net.names];
  const search = feedbackCircuits(net, MAX_CIRCUIT_LENGTH, MAX_CIRCUITS);
  const s = nodeSensitivities(net);
  return {
    nodes: names,
    circuits: search.circuits.map((c) => ({ nodes: c.nodes.map((i) => names[i]!), sign: c.sign })),
    circuitsComplete: search.complete,
    sensitivity: names.map((node, i) => ({ node, value: s[i]! })),
    averageSensitivity: s.length === 0 ? 0 : s.reduce((a, b) => a + b, 0) / s.length,
    canalizing: canalizingInputs(net).map((c) => ({
      node: names[c.node]!,
      regulator: names[c.regulator]!,
      inputValue: c.inputValue,
      output: c.output,
    })),
    nonEssential: interactionGraph(net)
      .edges.filter((e) => e.sign === "non-essential")
      .map((e) => ({ node: names[e.target]!, regulator: names[e.source]! })),
  };
}
