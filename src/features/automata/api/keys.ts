// Query keys of the automata feature, narrowest last so an invalidation can pick its prefix.
import type { HierarchyParameters } from "@shared/schemas/automata";

export const automataKeys = {
  all: ["automata"] as const,
  hierarchies: () => [...automataKeys.all, "hierarchies"] as const,
  hierarchy: (p: HierarchyParameters) => [...automataKeys.all, "hierarchy", p.maxBlock, p.timeMode, p.radius] as const,
  rule: (rule: number, p: HierarchyParameters) =>
    [...automataKeys.all, "rule", rule, p.maxBlock, p.timeMode, p.radius] as const,
  witness: (source: number, target: number, p: HierarchyParameters) =>
    [...automataKeys.all, "witness", source, target, p.maxBlock, p.timeMode, p.radius] as const,
};

export function parameterQuery(p: HierarchyParameters): string {
  return `maxBlock=${p.maxBlock}&timeMode=${p.timeMode}&radius=${p.radius}`;
}
