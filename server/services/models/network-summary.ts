// The small facts about a revision that lists and headers show without compiling the model again.
import type { ModelDefinition } from "@shared/engine/rules";
import type { BooleanNetwork } from "@shared/engine/network";
import type { NetworkSummary } from "@shared/schemas/models";

export function networkSummary(definition: ModelDefinition, net: BooleanNetwork): NetworkSummary {
  let edgeCount = 0;
  const inputs: string[] = [];
  net.names.forEach((name, i) => {
    const regs = net.regulators[i]!;
    edgeCount += regs.length;
    // An input keeps its value: its only regulator is itself and its table is the identity.
    const table = net.tables[i]!;
    if (regs.length === 1 && regs[0] === i && table[0] === 0 && table[1] === 1) inputs.push(name);
  });
  const thresholdNodes = definition.nodes.filter((n) => n.rule.kind === "threshold").map((n) => n.name);
  return { nodes: [...net.names], edgeCount, inputs, thresholdNodes };
}
