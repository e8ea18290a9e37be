// The registry of run kinds the queue accepts; a kind is usable once it is listed here.
import type { RunKindDefinition } from "../run-kind";
import { asyncAttractorsKind } from "./async-attractors";
import { attractorsKind } from "./attractors";
import { ecaHierarchyKind } from "./eca-hierarchy";
import { expectationCheckKind } from "./expectation-check";
import { nodeEliminationKind } from "./node-elimination";
import { reductionSearchKind } from "./reduction-search";
import { satCyclesKind } from "./sat-cycles";
import { screenKind } from "./screen";
import { sleepCountKind } from "./sleep-count";
import { trapSpacesKind } from "./trap-spaces";

const all: RunKindDefinition[] = [
  sleepCountKind,
  ecaHierarchyKind,
  attractorsKind,
  reductionSearchKind,
  satCyclesKind,
  trapSpacesKind,
  asyncAttractorsKind,
  expectationCheckKind,
  screenKind,
  nodeEliminationKind,
];
const kinds = new Map(all.map((k) => [k.kind, k]));

export function runKind(kind: string): RunKindDefinition | undefined {
  return kinds.get(kind);
}
