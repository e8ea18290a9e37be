// The structure tab as the API shows it: the engine's interaction graph with node names instead of indices, plus
// per-node degrees and printed rules (edge signs follow the engine's convention, shared/engine/structure).
import type { BooleanNetwork } from "@shared/engine/network";
import { printRule, type ModelDefinition } from "@shared/engine/rules";
import { interactionGraph } from "@shared/engine/structure";
import type { StructureResult } from "@shared/schemas/models";

/** `inputs` names the nodes the revision summary marks as inputs. */
export function structureView(
  definition: ModelDefinition,
  net: BooleanNetwork,
  inputs: readonly string[],
): StructureResult {
  const edges = interactionGraph(net).edges.map((e) => ({
    source: net.names[e.source]!,
    target: net.names[e.target]!,
    sign: e.sign,
  }));
  // Degrees count every listed regulator, non-essential ones included, unlike the engine's essential-only degrees:
  // the table shows what the rules mention.
  const outDegree = new Map<string, number>();
  for (const e of edges) outDegree.set(e.source, (outDegree.get(e.source) ?? 0) + 1);
  const isInput = new Set(inputs);
  return {
    nodes: definition.nodes.map((n, i) => ({
      name: n.name,
      inDegree: net.regulators[i]!.length,
      outDegree: outDegree.get(n.name) ?? 0,
      isInput: isInput.has(n.name),
      rule: printRule(n.rule),
    })),
    edges,
  };
}
