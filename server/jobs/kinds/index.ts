// The registry of run kinds the queue accepts; a kind is usable once it is listed here.
import type { RunKindDefinition } from "../run-kind";
import { attractorsKind } from "./attractors";
import { ecaHierarchyKind } from "./eca-hierarchy";
import { reductionSearchKind } from "./reduction-search";
import { sleepCountKind } from "./sleep-count";

const kinds = new Map<string, RunKindDefinition<never>>(
  [sleepCountKind, ecaHierarchyKind, attractorsKind, reductionSearchKind].map((k) => [
    k.kind,
    k as unknown as RunKindDefinition<never>,
  ]),
);

export function runKind(kind: string): RunKindDefinition<unknown> | undefined {
  return kinds.get(kind) as RunKindDefinition<unknown> | undefined;
}
